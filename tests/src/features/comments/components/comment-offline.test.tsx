// @vitest-environment jsdom
import 'fake-indexeddb/auto';
import { cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { CommentsRail } from '../../../../../src/features/comments/components/comments-rail';
import { comment, flightId } from '../../../helpers/comment-fixture';
import { railProps } from '../../../helpers/rail-props';
import { closeLocalDb, listOutbox, localDb } from '../../../../../src/lib/local-db';

let stored: unknown[] = [];

beforeEach(() => {
  stored = [];
  // The list and members came in while online; the comment is written after the link dropped.
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
      const url = String(input);
      if ((init?.method ?? 'GET') !== 'GET') throw new TypeError('Failed to fetch');
      const body = url.endsWith('/comments') ? { comments: stored } : { members: [] };
      return new Response(JSON.stringify(body), {
        status: 200,
        headers: { 'Content-Type': 'application/json' },
      });
    }),
  );
});

afterEach(async () => {
  cleanup();
  vi.unstubAllGlobals();
  await localDb().delete();
  await closeLocalDb();
});

/** The rail of a pilot's own flight, with the cursor at `cursorT`. */
function renderRail(cursorT: number) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  render(
    <QueryClientProvider client={client}>
      <CommentsRail {...railProps({ cursorT })} />
    </QueryClientProvider>,
  );
}

describe('comment written offline', () => {
  it('stays in the thread and waits in the outbox with its own id and moment', async () => {
    renderRail(7.5);
    const user = userEvent.setup();
    await screen.findByText('No comments yet.');
    await user.type(
      screen.getByRole('textbox', { name: 'Comment at the cursor' }),
      'Props chipped on landing',
    );
    await user.click(screen.getByRole('button', { name: 'Comment' }));

    expect(await screen.findByText(/Offline: your comment is kept/)).toBeTruthy();
    expect(screen.getByText('Props chipped on landing')).toBeTruthy();
    const [entry, ...rest] = await listOutbox();
    expect(rest).toHaveLength(0);
    expect(entry).toMatchObject({
      method: 'PUT',
      state: 'pending',
      body: { flightId, tS: 7.5, body: 'Props chipped on landing', mentions: [] },
    });
    expect(entry!.path).toBe(`/api/comments/${entry!.id}`);
  });

  it('queues an edit of a stored comment with the version it started from', async () => {
    stored = [
      comment({
        id: 'aaaaaaaa-0000-4000-8000-000000000001',
        tS: 7.5,
        body: 'Hover drifts left here.',
        version: 4,
      }),
    ];
    renderRail(0);
    const user = userEvent.setup();
    await screen.findByText('Hover drifts left here.');
    await user.click(screen.getByRole('button', { name: 'Edit' }));
    const box = screen.getByRole('textbox', { name: 'Edit comment' });
    await user.clear(box);
    await user.type(box, 'Drifts left: CG aft');
    await user.click(screen.getByRole('button', { name: 'Save' }));

    expect(await screen.findByText(/Offline: your change is kept/)).toBeTruthy();
    expect(screen.getByText('Drifts left: CG aft')).toBeTruthy();
    const [entry] = await listOutbox();
    expect(entry).toMatchObject({
      method: 'PATCH',
      path: '/api/comments/aaaaaaaa-0000-4000-8000-000000000001',
      version: 4,
      label: 'Edit of your comment at 7.50 s',
      body: { body: 'Drifts left: CG aft', mentions: [] },
    });
  });
});
