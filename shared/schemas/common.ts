import { z } from 'zod';

/** Ids are UUIDs; flights and comments get theirs from the client so retries are idempotent. */
export const Id = z.uuid({ message: 'expected a UUID' });
export type Id = z.infer<typeof Id>;

export const IdParam = z.object({ id: Id });
export const TeamIdParam = z.object({ teamId: Id });
export const MemberParam = z.object({ teamId: Id, userId: Id });
export const InviteParam = z.object({ teamId: Id, inviteId: Id });
export const ServiceEntryParam = z.object({ id: Id, entryId: Id });
export const BenchRunParam = z.object({ id: Id, runId: Id });
export const TokenParam = z.object({
  token: z.string().regex(/^[A-Za-z0-9_-]{20,128}$/, 'malformed token'),
});

/** ISO 8601 date-time string as the API sends it. */
export const IsoDateTime = z.iso.datetime({
  offset: true,
  message: 'expected an ISO 8601 date-time',
});
/** Calendar day, YYYY-MM-DD. */
export const IsoDate = z.iso.date({ message: 'expected a date as YYYY-MM-DD' });

export const Role = z.enum(['owner', 'tuner', 'pilot', 'coach', 'viewer']);
export type Role = z.infer<typeof Role>;

/**
 * Characters a name shown in mail subjects and lists must not carry: control characters
 * (C0, C1), line and paragraph separators, and the bidirectional marks, embeddings, overrides
 * and isolates that can make "Mara" read as something else (Unicode TR #9, §2).
 */
const unsafeInName =
  // eslint-disable-next-line no-control-regex
  /[\u0000-\u001f\u007f-\u009f\u061c\u200e\u200f\u2028\u2029\u202a-\u202e\u2066-\u2069]+/g;

/** A name of a person, team, aircraft or preset: unsafe characters become one space, then trimmed. */
export const DisplayName = (max: number, empty = 'enter a name') =>
  z
    .string()
    .overwrite((v) => v.replace(unsafeInName, ' ').replace(/ {2,}/g, ' '))
    .trim()
    .min(1, empty)
    .max(max);

/** Who did something, as lists show it. */
export const UserRef = z.object({ id: Id, name: z.string() });
export type UserRef = z.infer<typeof UserRef>;
