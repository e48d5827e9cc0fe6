// @vitest-environment jsdom
import 'fake-indexeddb/auto';
import { cleanup, screen } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { Role } from '../../../../../shared/schemas/common';
import { CommentsRail } from '../../../../../src/features/comments/components/comments-rail';
import { pilot } from '../../../helpers/comment-fixture';
import { railProps } from '../../../helpers/rail-props';
import { jsonResponse, renderWithQuery } from '../../../helpers/render-with-query';

const otherPilot = { id: '22222222-2222-4222-8222-222222222222', name: 'Ivo Sparrow' };
const coach = {
  userId: '33333333-3333-4333-8333-333333333333',
  name: 'Mae Gannet',
  email: 'mae@tern-field.example',
  role: 'coach',
  joinedAt: '2026-05-01T09:00:00.000Z',
};

beforeEach(() => {
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL) =>
      String(input).endsWith('/comments')
        ? jsonResponse(200, { comments: [] })
        : jsonResponse(200, { members: [coach] }),
    ),
  );
});

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

/** The rail as `me` with `role` sees it on a flight `pilotId` flew. */
async function renderRail(me: typeof pilot, role: Role, pilotId: string) {
  renderWithQuery(<CommentsRail {...railProps({ me, role, pilotId })} />);
  await screen.findByText('No comments yet.');
}

describe('asking for a review', () => {
  it('is offered to a pilot on a flight they flew', async () => {
    await renderRail(pilot, 'pilot', pilot.id);
    expect(screen.getByText('Ask for a review')).toBeTruthy();
    expect(await screen.findByRole('button', { name: 'Request review' })).toBeTruthy();
  });

  it('is not offered to a pilot on a flight someone else flew (the server refuses it)', async () => {
    await renderRail(pilot, 'pilot', otherPilot.id);
    expect(screen.getByRole('textbox', { name: 'Comment at the cursor' })).toBeTruthy();
    expect(screen.queryByText('Ask for a review')).toBeNull();
  });

  it('is offered to tuners and owners on any flight', async () => {
    for (const role of ['tuner', 'owner'] as const) {
      await renderRail(pilot, role, otherPilot.id);
      expect([role, screen.queryByText('Ask for a review') !== null]).toEqual([role, true]);
      cleanup();
    }
  });
});
