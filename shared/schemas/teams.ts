import { z } from 'zod';
import { Email } from './auth';
import { DisplayName, Id, IsoDateTime, Role } from './common';

export const TeamName = DisplayName(80, 'enter a team name');

export const TeamInput = z.object({ name: TeamName });
export type TeamInput = z.infer<typeof TeamInput>;
export const TeamPatch = z.object({ name: TeamName });
export type TeamPatch = z.infer<typeof TeamPatch>;

/** A team as the caller sees it, with the caller's own role in it. */
export const Team = z.object({
  id: Id,
  name: z.string(),
  role: Role,
  memberCount: z.number().int(),
  createdAt: IsoDateTime,
});
export type Team = z.infer<typeof Team>;
export const TeamList = z.object({ teams: z.array(Team) });
export type TeamList = z.infer<typeof TeamList>;

export const Member = z.object({
  userId: Id,
  name: z.string(),
  email: z.string(),
  role: Role,
  joinedAt: IsoDateTime,
});
export type Member = z.infer<typeof Member>;
export const MemberList = z.object({ members: z.array(Member) });
export type MemberList = z.infer<typeof MemberList>;

export const MemberPatch = z.object({ role: Role });
export type MemberPatch = z.infer<typeof MemberPatch>;

export const InviteInput = z.object({ email: Email, role: Role });
export type InviteInput = z.infer<typeof InviteInput>;

/**
 * Where an invitation stands: `open` until someone joins with it (`accepted`), the owner takes it
 * back (`withdrawn`) or its week runs out (`expired`). Only an open link lets anyone in.
 */
export const InviteState = z.enum(['open', 'accepted', 'withdrawn', 'expired']);
export type InviteState = z.infer<typeof InviteState>;

export const Invite = z.object({
  id: Id,
  teamId: Id,
  email: z.string(),
  role: Role,
  state: InviteState,
  expiresAt: IsoDateTime,
  /** When it was sent. */
  createdAt: IsoDateTime,
  invitedBy: z.string(),
  acceptedAt: IsoDateTime.nullable(),
  /** Who joined with it: anyone holding the link can, so it may not be the invited address. */
  acceptedBy: z.string().nullable(),
  withdrawnAt: IsoDateTime.nullable(),
  withdrawnBy: z.string().nullable(),
  /**
   * The accept link, for the owner to pass on by hand. Only in the answer that creates the invite:
   * the server keeps just a hash of the token, so it cannot show the link again later.
   */
  link: z.url().optional(),
});
export type Invite = z.infer<typeof Invite>;
export const InviteList = z.object({ invites: z.array(Invite) });
export type InviteList = z.infer<typeof InviteList>;

/** What an invite link shows before it is accepted (no sign-in needed). */
export const InvitePreview = z.object({
  teamName: z.string(),
  role: Role,
  email: z.string(),
  invitedBy: z.string(),
  expiresAt: IsoDateTime,
});
export type InvitePreview = z.infer<typeof InvitePreview>;

export const AcceptInviteResponse = z.object({ team: Team });
export type AcceptInviteResponse = z.infer<typeof AcceptInviteResponse>;
