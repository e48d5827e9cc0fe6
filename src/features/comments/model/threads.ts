import type { Comment } from '../../../../shared/schemas/comments';

export interface Thread {
  root: Comment;
  replies: Comment[];
}

/** Roots by time in the flight (then creation), replies under them by creation. */
export function toThreads(comments: readonly Comment[]): Thread[] {
  const roots = comments.filter((c) => c.parentId === null);
  const byParent = new Map<string, Comment[]>();
  for (const c of comments) {
    if (c.parentId === null) continue;
    const list = byParent.get(c.parentId) ?? [];
    list.push(c);
    byParent.set(c.parentId, list);
  }
  return roots
    .sort((a, b) => a.tS - b.tS || a.createdAt.localeCompare(b.createdAt))
    .map((root) => ({
      root,
      replies: (byParent.get(root.id) ?? []).sort((a, b) => a.createdAt.localeCompare(b.createdAt)),
    }));
}
