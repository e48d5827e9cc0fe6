import type { UserRef } from '../../../../shared/schemas/common';

/** The `@word` being typed just before the caret, or null. */
export function mentionQuery(text: string, caret: number): { start: number; query: string } | null {
  const before = text.slice(0, caret);
  const m = /(^|\s)@([\p{L}\p{N}._-]{0,40})$/u.exec(before);
  if (!m) return null;
  return { start: caret - m[2]!.length - 1, query: m[2]! };
}

/** Members whose name starts with (or contains a word starting with) the query. */
export function matchMembers(members: readonly UserRef[], query: string, limit = 6): UserRef[] {
  const q = query.toLowerCase();
  return members
    .filter((m) => {
      const name = m.name.toLowerCase();
      return q === '' || name.startsWith(q) || name.split(/\s+/).some((w) => w.startsWith(q));
    })
    .slice(0, limit);
}

/** The body with `@query` replaced by the member's handle, and where the caret goes after it. */
export function insertMention(
  text: string,
  start: number,
  caret: number,
  member: UserRef,
): { text: string; caret: number } {
  const handle = `@${member.name} `;
  return { text: text.slice(0, start) + handle + text.slice(caret), caret: start + handle.length };
}

/** Members actually named in the body as `@Full Name`: a picked mention that was deleted again is not sent. */
export function mentionedIn(body: string, members: readonly UserRef[]): UserRef[] {
  return members.filter((m) => body.includes(`@${m.name}`));
}

/** Splits a body into text and mention parts, for highlighting. */
export function splitMentions(
  body: string,
  names: readonly string[],
): { text: string; mention: boolean }[] {
  if (names.length === 0) return [{ text: body, mention: false }];
  const escaped = [...names]
    .sort((a, b) => b.length - a.length)
    .map((n) => n.replace(/[.*+?^${}()|[\]\\]/g, '\\$&'));
  const re = new RegExp(`@(?:${escaped.join('|')})`, 'g');
  const out: { text: string; mention: boolean }[] = [];
  let last = 0;
  for (const m of body.matchAll(re)) {
    if (m.index! > last) out.push({ text: body.slice(last, m.index), mention: false });
    out.push({ text: m[0], mention: true });
    last = m.index! + m[0].length;
  }
  if (last < body.length) out.push({ text: body.slice(last), mention: false });
  return out;
}
