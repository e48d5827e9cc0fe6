import type { Comment } from '../../../shared/schemas/comments';

/** The flight and people the comment tests share. */
export const flightId = '7d2f1c3b-4e5a-4b6c-8d7e-9f0a1b2c3d4e';
export const pilot = { id: '11111111-1111-4111-8111-111111111111', name: 'Rosa Kite' };

/** A top-level comment by the pilot on that flight, open and unedited, unless `over` says so. */
export function comment(over: Partial<Comment> & Pick<Comment, 'id' | 'tS' | 'body'>): Comment {
  return {
    flightId,
    parentId: null,
    channel: null,
    deleted: false,
    author: pilot,
    mentions: [],
    resolvedAt: null,
    resolvedBy: null,
    editedAt: null,
    createdAt: '2026-05-02T10:00:00.000Z',
    version: 1,
    ...over,
  };
}
