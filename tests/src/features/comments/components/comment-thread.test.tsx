// @vitest-environment jsdom
import { act, cleanup, render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { Comment } from '../../../../../shared/schemas/comments';
import { comment, flightId, pilot } from '../../../helpers/comment-fixture';
import type { Role } from '../../../../../shared/schemas/common';
import { CommentsRail } from '../../../../../src/features/comments/components/comments-rail';

const teamId = '0b7e6d1a-2f43-4c1e-9d7a-5a3c2b1e0f01';
const coach = { id: '22222222-2222-4222-8222-222222222222', name: 'Dev Heron' };
const viewer = { id: '33333333-3333-4333-8333-333333333333', name: 'Sam Osprey' };

const late = comment({
  id: 'aaaaaaaa-0000-4000-8000-000000000001',
  tS: 31.5,
  body: 'Yaw kick on the punch-out.',
});
const early = comment({
  id: 'aaaaaaaa-0000-4000-8000-000000000002',
  tS: 4.25,
  body: 'Hover drifts left here.',
});
const reply = comment({
  id: 'aaaaaaaa-0000-4000-8000-000000000003',
  tS: 4.25,
  body: 'Battery strap moved?',
  parentId: early.id,
  author: coach,
  createdAt: '2026-05-02T11:00:00.000Z',
});

interface Call {
  method: string;
  url: string;
  body: unknown;
}
let calls: Call[];
/** What the stub server has stored; GET answers from it, PUT and PATCH change it. */
let stored: Comment[];
let putGate: { release: (status: number) => void } | null;

const json = (status: number, body: unknown) =>
  new Response(status === 204 ? null : JSON.stringify(body), {
    status,
    headers: { 'Content-Type': 'application/json' },
  });

beforeEach(() => {
  calls = [];
  stored = [late, early, reply];
  putGate = null;
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
      const url = String(input);
      const method = init?.method ?? 'GET';
      const body = typeof init?.body === 'string' ? JSON.parse(init.body) : undefined;
      calls.push({ method, url, body });
      if (method === 'GET' && url === `/api/flights/${flightId}/comments`)
        return json(200, { comments: stored });
      if (method === 'GET' && url === `/api/teams/${teamId}/members`)
        return json(200, {
          members: [pilot, coach, viewer].map((u, i) => ({
            userId: u.id,
            name: u.name,
            email: `m${i}@example.test`,
            role: (['pilot', 'coach', 'viewer'] as Role[])[i],
            joinedAt: '2026-01-01T00:00:00.000Z',
          })),
        });
      if (method === 'PUT' && url.startsWith('/api/comments/')) {
        const id = url.split('/').pop()!;
        const status = await new Promise<number>((release) => (putGate = { release }));
        if (status !== 201)
          return json(status, { error: { code: 'forbidden', message: 'Viewers cannot comment.' } });
        const created = comment({
          id,
          tS: body.tS,
          body: body.body,
          author: pilot,
          mentions: [coach],
        });
        stored = [...stored, created];
        return json(201, created);
      }
      if (method === 'PATCH' && url.startsWith('/api/comments/')) {
        const id = url.split('/').pop()!;
        const resolved = {
          ...stored.find((c) => c.id === id)!,
          resolvedAt: '2026-05-02T12:00:00.000Z',
          resolvedBy: coach,
        };
        stored = stored.map((c) => (c.id === id ? resolved : c));
        return json(200, resolved);
      }
      return json(404, { error: { code: 'not_found', message: `no route ${method} ${url}` } });
    }),
  );
});

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

function renderRail(me: { id: string; name: string }, role: Role, cursorT = 18.75) {
  const onSeek = vi.fn();
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  render(
    <QueryClientProvider client={client}>
      <CommentsRail
        flightId={flightId}
        teamId={teamId}
        me={me}
        role={role}
        pilotId={pilot.id}
        cursorT={cursorT}
        onSeek={onSeek}
        selectedId={null}
        onSelect={vi.fn()}
      />
    </QueryClientProvider>,
  );
  return { onSeek, user: userEvent.setup() };
}

const threads = () => within(screen.getByRole('list', { name: 'Comment threads' }));

describe('comment thread', () => {
  it('lists threads by their moment in the flight with replies beneath, and a pin moves the cursor', async () => {
    const { onSeek, user } = renderRail(pilot, 'pilot');
    await screen.findByText('Hover drifts left here.');
    const articles = threads().getAllByRole('article');
    expect(articles[0]!.getAttribute('aria-label')).toBe('Comment by Rosa Kite at 4.25 s');
    expect(articles[1]!.getAttribute('aria-label')).toBe('Comment by Rosa Kite at 31.50 s');
    expect(
      within(within(articles[0]!).getByRole('list', { name: 'Replies' })).getByText(
        'Battery strap moved?',
      ),
    ).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Move the cursor to 31.50 s' }));
    expect(onSeek).toHaveBeenCalledWith(31.5);
  });

  it('adds a comment at the cursor at once, with the mention picked from the team, before the server answers', async () => {
    const { user } = renderRail(pilot, 'pilot', 18.75);
    await screen.findByText('Hover drifts left here.');
    const box = screen.getByRole('textbox', { name: 'Comment at the cursor' });
    expect(screen.getByText('at 18.75 s')).toBeTruthy();
    await user.type(box, 'Motor 3 sounds rough @De');
    await user.click(
      within(await screen.findByRole('listbox', { name: 'Team members' })).getByRole('option', {
        name: 'Dev Heron',
      }),
    );
    await user.type(box, 'can you listen?');
    await user.click(screen.getByRole('button', { name: 'Comment' }));

    // Optimistic: shown while the PUT is still waiting.
    expect(await screen.findByText('Motor 3 sounds rough')).toBeTruthy();
    const put = calls.find((c) => c.method === 'PUT')!;
    expect(put.body).toMatchObject({
      flightId,
      tS: 18.75,
      body: 'Motor 3 sounds rough @Dev Heron can you listen?',
      mentions: [coach.id],
    });
    await act(async () => putGate!.release(201));
    // Once stored, the list is fetched again and the comment stays, its mention marked.
    await waitFor(() =>
      expect(
        calls.filter((c) => c.method === 'GET' && c.url.endsWith('/comments')).length,
      ).toBeGreaterThan(1),
    );
    expect(await screen.findByText('@Dev Heron')).toBeTruthy();
  });

  it('takes the comment back out of the thread, into the box, and says why when the server refuses it', async () => {
    const { user } = renderRail(pilot, 'pilot');
    await screen.findByText('Hover drifts left here.');
    await user.type(
      screen.getByRole('textbox', { name: 'Comment at the cursor' }),
      'Landing was hard',
    );
    await user.click(screen.getByRole('button', { name: 'Comment' }));
    expect(await screen.findByText('Landing was hard')).toBeTruthy();
    await act(async () => putGate!.release(403));
    expect((await screen.findByRole('alert')).textContent).toContain('Viewers cannot comment.');
    expect(threads().queryByText('Landing was hard')).toBeNull();
    // What was typed is not lost: it is back in the box.
    expect(
      (screen.getByRole('textbox', { name: 'Comment at the cursor' }) as HTMLTextAreaElement).value,
    ).toBe('Landing was hard');
  });

  it('lets a coach resolve a thread', async () => {
    const { user } = renderRail(coach, 'coach');
    await screen.findByText('Hover drifts left here.');
    const first = threads().getAllByRole('article')[0]!;
    await user.click(within(first).getByRole('button', { name: 'Resolve' }));
    expect(calls.find((c) => c.method === 'PATCH')).toMatchObject({
      url: `/api/comments/${early.id}`,
      body: { resolved: true },
    });
    expect(await within(first).findByText(/resolved by Dev Heron/)).toBeTruthy();
  });

  it('shows a viewer the threads but no comment box, reply or resolve', async () => {
    renderRail(viewer, 'viewer');
    await screen.findByText('Hover drifts left here.');
    expect(screen.queryByRole('textbox', { name: 'Comment at the cursor' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Reply' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Resolve' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Request review' })).toBeNull();
  });
});
