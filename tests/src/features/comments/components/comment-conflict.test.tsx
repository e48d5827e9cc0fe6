// @vitest-environment jsdom
import { cleanup, render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { Comment } from '../../../../../shared/schemas/comments';
import { comment, flightId, pilot } from '../../../helpers/comment-fixture';
import type { Role } from '../../../../../shared/schemas/common';
import { CommentsRail } from '../../../../../src/features/comments/components/comments-rail';

const teamId = '0b7e6d1a-2f43-4c1e-9d7a-5a3c2b1e0f01';
const coach = { id: '22222222-2222-4222-8222-222222222222', name: 'Dev Heron' };

const mine = comment({
  id: 'aaaaaaaa-0000-4000-8000-000000000001',
  tS: 7.5,
  body: 'Hover drifts left here.',
});

let patches: { ifMatch: string | null; body: unknown }[];
/** What the server holds: the coach resolved the thread (version 2) after this page loaded. */
let server: Comment;
let shown: Comment;

const json = (status: number, body: unknown, etag?: number) =>
  new Response(JSON.stringify(body), {
    status,
    headers: { 'Content-Type': 'application/json', ...(etag ? { ETag: `"${etag}"` } : {}) },
  });

beforeEach(() => {
  patches = [];
  shown = mine;
  server = mine;
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
      const url = String(input);
      const method = init?.method ?? 'GET';
      if (method === 'GET' && url.endsWith('/comments')) return json(200, { comments: [shown] });
      if (method === 'GET' && url.endsWith('/members')) return json(200, { members: [] });
      if (method === 'PATCH') {
        const ifMatch = new Headers(init?.headers).get('If-Match');
        const body = JSON.parse(String(init?.body)) as { body?: string };
        patches.push({ ifMatch, body });
        if (ifMatch !== `"${server.version}"`)
          return json(
            412,
            {
              error: {
                code: 'version_conflict',
                message: 'This comment was changed by someone else.',
                currentVersion: server.version,
              },
            },
            server.version,
          );
        server = { ...server, body: body.body ?? server.body, version: server.version + 1 };
        shown = server;
        return json(200, server, server.version);
      }
      return json(404, { error: { code: 'not_found', message: `no route ${method} ${url}` } });
    }),
  );
});

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

function renderRail(role: Role, me = pilot) {
  const client = new QueryClient({
    defaultOptions: { queries: { retry: false }, mutations: { retry: false } },
  });
  render(
    <QueryClientProvider client={client}>
      <CommentsRail
        flightId={flightId}
        teamId={teamId}
        me={me}
        role={role}
        pilotId={pilot.id}
        cursorT={0}
        onSeek={vi.fn()}
        selectedId={null}
        onSelect={vi.fn()}
      />
    </QueryClientProvider>,
  );
  return userEvent.setup();
}

async function editTo(user: ReturnType<typeof userEvent.setup>, text: string) {
  await screen.findByText('Hover drifts left here.');
  await user.click(screen.getByRole('button', { name: 'Edit' }));
  const box = screen.getByRole('textbox', { name: 'Edit comment' });
  await user.clear(box);
  await user.type(box, text);
  await user.click(screen.getByRole('button', { name: 'Save' }));
}

describe('editing a comment someone else changed meanwhile', () => {
  it('sends the version it started from and, on 412, offers reload or overwrite', async () => {
    server = { ...mine, body: 'Hover drifts left — CG moved aft.', version: 2 };
    const user = renderRail('pilot');
    await editTo(user, 'Hover drifts left; strap the pack tighter.');

    const alert = await screen.findByRole('alert');
    expect(alert.textContent).toContain('Changed by someone else since you opened this comment');
    expect(patches[0]!.ifMatch).toBe('"1"');
    // Nothing stored over theirs.
    expect(server.body).toBe('Hover drifts left — CG moved aft.');

    await user.click(within(alert).getByRole('button', { name: 'Overwrite' }));
    await waitFor(() => expect(patches).toHaveLength(2));
    expect(patches[1]).toEqual({
      ifMatch: '"2"',
      body: { body: 'Hover drifts left; strap the pack tighter.', mentions: [] },
    });
    await waitFor(() => expect(screen.queryByRole('alert')).toBeNull());
    expect(server).toMatchObject({
      body: 'Hover drifts left; strap the pack tighter.',
      version: 3,
    });
  });

  it('reload takes their version and drops the local edit', async () => {
    server = { ...mine, body: 'Hover drifts left — CG moved aft.', version: 2 };
    const user = renderRail('pilot');
    await editTo(user, 'My wording');
    const alert = await screen.findByRole('alert');
    shown = server; // the list now answers with their change
    await user.click(within(alert).getByRole('button', { name: 'Reload' }));
    expect(await screen.findByText('Hover drifts left — CG moved aft.')).toBeTruthy();
    await waitFor(() => expect(screen.queryByRole('alert')).toBeNull());
    expect(screen.queryByText('My wording')).toBeNull();
    expect(patches).toHaveLength(1);
  });
});

describe('edit and delete follow the current role', () => {
  it('offers Edit and Delete on own comments while the role comments', async () => {
    renderRail('pilot');
    await screen.findByText('Hover drifts left here.');
    expect(screen.getByRole('button', { name: 'Edit' })).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Delete' })).toBeTruthy();
  });

  it('hides Edit and Delete on own comments from a member demoted to viewer', async () => {
    renderRail('viewer');
    await screen.findByText('Hover drifts left here.');
    expect(screen.queryByRole('button', { name: 'Edit' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Delete' })).toBeNull();
  });

  it('lets the owner delete a comment that is not theirs, but not edit it', async () => {
    renderRail('owner', coach);
    await screen.findByText('Hover drifts left here.');
    expect(screen.queryByRole('button', { name: 'Edit' })).toBeNull();
    expect(screen.getByRole('button', { name: 'Delete' })).toBeTruthy();
  });
});
