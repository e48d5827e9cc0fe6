import 'fake-indexeddb/auto';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import {
  closeLocalDb,
  enqueue,
  listOutbox,
  localDb,
  overwriteOutboxConflict,
  removeOutboxEntry,
} from '../../../../src/lib/local-db';
import { runSyncPass, type SyncDeps } from '../../../../src/features/sync/sync-runner';

const COMMENT = '44444444-4444-4444-8444-444444444444';
const OTHER = '55555555-5555-4555-8555-555555555555';

/**
 * A fake comment server that keeps a version per comment the way server/comments does: a PATCH
 * naming an older version in If-Match is refused with 412 and the current version (body and
 * ETag); a PATCH without If-Match, or with the current one, is stored and bumps the version.
 */
function versionedServer(versions: Record<string, number>) {
  const seen: { url: string; ifMatch: string | null; body: unknown }[] = [];
  const stored: Record<string, unknown> = {};
  const fetchStub = async (input: RequestInfo | URL, init?: RequestInit) => {
    const url = String(input);
    const ifMatch = new Headers(init?.headers).get('If-Match');
    const body = typeof init?.body === 'string' ? JSON.parse(init.body) : undefined;
    seen.push({ url, ifMatch, body });
    const id = url.split('/').pop()!;
    const current = versions[id]!;
    if (ifMatch !== null && Number(ifMatch.replace(/"/g, '')) !== current)
      return new Response(
        JSON.stringify({
          error: {
            code: 'version_conflict',
            message: `This comment was changed by someone else (now version ${current}).`,
            currentVersion: current,
          },
        }),
        { status: 412, headers: { 'Content-Type': 'application/json', ETag: `"${current}"` } },
      );
    versions[id] = current + 1;
    stored[id] = body;
    return new Response(JSON.stringify({ id, version: current + 1 }), {
      status: 200,
      headers: { 'Content-Type': 'application/json', ETag: `"${current + 1}"` },
    });
  };
  return { seen, stored, versions, fetch: fetchStub as typeof fetch };
}

const deps = (server: ReturnType<typeof versionedServer>): SyncDeps => ({
  fetch: server.fetch,
  now: () => 1_000_000,
  defaultTeamId: () => undefined,
});

beforeEach(async () => {
  await localDb().delete();
  await closeLocalDb();
});
afterEach(closeLocalDb);

describe('offline edits replayed with If-Match', () => {
  it('sends the version the edit started from, and stores it when nobody changed it since', async () => {
    await enqueue({
      id: COMMENT,
      method: 'PATCH',
      path: `/api/comments/${COMMENT}`,
      body: { body: 'Props swapped' },
      version: 3,
    });
    const server = versionedServer({ [COMMENT]: 3 });
    const result = await runSyncPass(deps(server));
    expect(server.seen[0]!.ifMatch).toBe('"3"');
    expect(result).toMatchObject({ writesSent: 1, conflicts: 0 });
    expect(await listOutbox()).toEqual([]);
  });

  it('keeps an edit someone else overtook as a conflict instead of overwriting, and sends the rest', async () => {
    await enqueue({
      id: COMMENT,
      method: 'PATCH',
      path: `/api/comments/${COMMENT}`,
      body: { body: 'Mine, typed at the field' },
      version: 1,
      label: 'Edit of your comment at 7.50 s',
    });
    await enqueue({
      id: OTHER,
      method: 'PATCH',
      path: `/api/comments/${OTHER}`,
      body: { resolved: true },
      version: 2,
    });
    // The coach edited the first comment twice while this device was offline.
    const server = versionedServer({ [COMMENT]: 3, [OTHER]: 2 });

    const result = await runSyncPass(deps(server));
    expect(result).toMatchObject({ writesSent: 1, conflicts: 1, refused: 0 });
    expect(server.stored[COMMENT]).toBeUndefined();
    expect(server.stored[OTHER]).toEqual({ resolved: true });
    const [entry, ...rest] = await listOutbox();
    expect(rest).toEqual([]);
    expect(entry).toMatchObject({
      id: COMMENT,
      state: 'conflict',
      version: 1,
      currentVersion: 3,
      label: 'Edit of your comment at 7.50 s',
    });
    expect(entry!.lastError).toContain('changed by someone else');

    // A conflict is not retried by itself: the next pass leaves it alone.
    const again = await runSyncPass(deps(server));
    expect(again).toMatchObject({ writesSent: 0, conflicts: 0 });
    expect(server.seen.filter((s) => s.url.endsWith(COMMENT))).toHaveLength(1);
  });

  it('overwrites on request, naming the version the server holds now', async () => {
    await enqueue({
      id: COMMENT,
      method: 'PATCH',
      path: `/api/comments/${COMMENT}`,
      body: { body: 'Mine after all' },
      version: 1,
    });
    const server = versionedServer({ [COMMENT]: 4 });
    await runSyncPass(deps(server));
    const [entry] = await listOutbox();
    await overwriteOutboxConflict(entry!.seq!);

    const result = await runSyncPass(deps(server));
    expect(result).toMatchObject({ writesSent: 1, conflicts: 0 });
    expect(server.seen.at(-1)!.ifMatch).toBe('"4"');
    expect(server.stored[COMMENT]).toEqual({ body: 'Mine after all' });
    expect(server.versions[COMMENT]).toBe(5);
    expect(await listOutbox()).toEqual([]);
  });

  it('drops the change when the pilot keeps theirs, sending nothing', async () => {
    await enqueue({
      id: COMMENT,
      method: 'PATCH',
      path: `/api/comments/${COMMENT}`,
      body: { body: 'Not needed' },
      version: 1,
    });
    const server = versionedServer({ [COMMENT]: 2 });
    await runSyncPass(deps(server));
    const [entry] = await listOutbox();
    await removeOutboxEntry(entry!.seq!);
    await runSyncPass(deps(server));
    expect(server.seen).toHaveLength(1);
    expect(server.stored[COMMENT]).toBeUndefined();
  });

  it('sends a write queued without a version as before, with no If-Match', async () => {
    await enqueue({ id: COMMENT, method: 'PATCH', path: `/api/comments/${COMMENT}`, body: {} });
    const server = versionedServer({ [COMMENT]: 7 });
    await runSyncPass(deps(server));
    expect(server.seen[0]!.ifMatch).toBeNull();
    expect(server.versions[COMMENT]).toBe(8);
  });
});
