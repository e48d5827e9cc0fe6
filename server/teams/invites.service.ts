import { randomUUID } from 'node:crypto';
import { In, IsNull, type DataSource, type EntityManager } from 'typeorm';
import type { Role } from '../../shared/schemas/common';
import type {
  Invite as InviteDto,
  InviteInput,
  InvitePreview,
  InviteState,
  Team as TeamDto,
} from '../../shared/schemas/teams';
import { User } from '../auth/user.entity';
import { hashToken, newToken } from '../auth/tokens';
import type { Config } from '../config';
import { withUserNames } from '../db/with-user-names';
import { AppError, BadRequestError, ConflictError, NotFoundError } from '../http/errors';
import { limits } from '../limits';
import type { Mailer } from '../mail/mailer';
import { inviteMail, inviteUrl } from '../mail/templates';
import { iso, isoOrNull } from '../util';
import { Invite } from './invite.entity';
import { Membership } from './membership.entity';
import { Team } from './team.entity';
import type { TeamsService } from './teams.service';

const INVITE_TTL_MS = 7 * 24 * 60 * 60 * 1000;

/** Accepted and withdrawn are final; an invite nobody used runs out after its week. */
export function inviteState(i: Invite, now = Date.now()): InviteState {
  if (i.acceptedAt !== null) return 'accepted';
  if (i.withdrawnAt !== null) return 'withdrawn';
  return i.expiresAt <= now ? 'expired' : 'open';
}

/**
 * Invitations to a team: the owner invites an address (mailed a one-time link), lists and
 * withdraws them; the link is previewed before signing in and spent on joining.
 */
export class InvitesService {
  constructor(
    private readonly ds: DataSource,
    private readonly config: Pick<Config, 'publicUrl'>,
    private readonly mailer: Mailer,
    private readonly teams: TeamsService,
  ) {}

  /** Invites an address; `created` is false when it already had an open invitation. */
  async create(
    actorId: string,
    teamId: string,
    input: InviteInput,
  ): Promise<{ invite: InviteDto; created: boolean }> {
    await this.teams.authorize(actorId, teamId, 'invites.manage');
    const existing = await this.ds
      .getRepository(Membership)
      .createQueryBuilder('m')
      .innerJoin(User, 'u', 'u.id = m.userId')
      .where('m.teamId = :teamId AND u.email = :email', { teamId, email: input.email })
      .getCount();
    if (existing > 0)
      throw new ConflictError(`${input.email} is already in this team.`, 'already_member');
    const now = Date.now();
    const invites = this.ds.getRepository(Invite);
    const openWhere =
      'i.teamId = :teamId AND i.acceptedAt IS NULL AND i.withdrawnAt IS NULL AND i.expiresAt > :now';
    // A second invite to an address that has an open one would only mail it again: answer
    // with the open one and send nothing.
    const pending = await withUserNames(
      invites
        .createQueryBuilder('i')
        .where(`${openWhere} AND i.email = :email`, { teamId, now, email: input.email }),
      'i.invitedById',
    );
    if (pending[0]) return { invite: this.inviteDto(pending[0][0], pending[0][1]), created: false };
    const open = await invites.createQueryBuilder('i').where(openWhere, { teamId, now }).getCount();
    if (open >= limits.openInvitesPerTeam) {
      throw new ConflictError(
        `This team already has ${limits.openInvitesPerTeam} open invitations. Withdraw some or wait until they are used.`,
        'too_many_invites',
      );
    }
    const token = newToken();
    const invite: Invite = {
      id: randomUUID(),
      teamId,
      email: input.email,
      role: input.role,
      tokenHash: hashToken(token),
      invitedById: actorId,
      expiresAt: now + INVITE_TTL_MS,
      acceptedAt: null,
      acceptedById: null,
      withdrawnAt: null,
      withdrawnById: null,
      createdAt: now,
    };
    await invites.insert(invite);
    const team = await this.ds.getRepository(Team).findOneByOrFail({ id: teamId });
    const by = await this.ds.getRepository(User).findOneByOrFail({ id: actorId });
    this.mailer.queue(
      inviteMail(this.config, {
        to: input.email,
        teamName: team.name,
        role: input.role,
        invitedBy: by.name,
        token,
        expiresAt: new Date(invite.expiresAt),
      }),
    );
    // The one moment the token is known in the clear; the owner may pass the link on by hand.
    return {
      invite: { ...this.inviteDto(invite, by.name), link: inviteUrl(this.config, token) },
      created: true,
    };
  }

  private inviteDto(
    i: Invite,
    invitedBy: string,
    names: ReadonlyMap<string, string> = new Map(),
    now = Date.now(),
  ): InviteDto {
    const nameOf = (id: string | null) => (id === null ? null : (names.get(id) ?? ''));
    return {
      id: i.id,
      teamId: i.teamId,
      email: i.email,
      role: i.role as Role,
      state: inviteState(i, now),
      expiresAt: iso(i.expiresAt),
      createdAt: iso(i.createdAt),
      invitedBy,
      acceptedAt: isoOrNull(i.acceptedAt),
      acceptedBy: nameOf(i.acceptedById),
      withdrawnAt: isoOrNull(i.withdrawnAt),
      withdrawnBy: nameOf(i.withdrawnById),
    };
  }

  async list(actorId: string, teamId: string): Promise<InviteDto[]> {
    await this.teams.authorize(actorId, teamId, 'invites.manage');
    const rows = await withUserNames(
      this.ds
        .getRepository(Invite)
        .createQueryBuilder('i')
        .where('i.teamId = :teamId', { teamId })
        .orderBy('i.createdAt', 'DESC'),
      'i.invitedById',
    );
    const ids = [
      ...new Set(
        rows.flatMap(([i]) => [i.acceptedById, i.withdrawnById]).filter((id) => id !== null),
      ),
    ];
    const users = ids.length > 0 ? await this.ds.getRepository(User).findBy({ id: In(ids) }) : [];
    const names = new Map(users.map((u) => [u.id, u.name]));
    const now = Date.now();
    return rows.map(([invite, invitedBy]) => this.inviteDto(invite, invitedBy, names, now));
  }

  /**
   * The owner takes back an invitation nobody has used: its link stops working at once and
   * says it was withdrawn. Withdrawing twice is harmless; an accepted one is a member to remove.
   */
  async withdraw(actorId: string, teamId: string, inviteId: string): Promise<void> {
    await this.teams.authorize(actorId, teamId, 'invites.manage');
    const repo = this.ds.getRepository(Invite);
    const invite = await repo.findOneBy({ id: inviteId, teamId });
    if (!invite) throw new NotFoundError('Invitation');
    if (invite.withdrawnAt !== null) return;
    const done = await repo.update(
      { id: inviteId, acceptedAt: IsNull(), withdrawnAt: IsNull() },
      { withdrawnAt: Date.now(), withdrawnById: actorId },
    );
    if (!done.affected) {
      throw new ConflictError(
        `${invite.email} has already joined with this invitation; remove them from the members instead.`,
        'invite_accepted',
      );
    }
  }

  /** The invite behind a link, if it still lets someone in; otherwise says plainly why not. */
  private async openInvite(token: string, em: EntityManager = this.ds.manager): Promise<Invite> {
    const invite = await em.getRepository(Invite).findOneBy({ tokenHash: hashToken(token) });
    const state = invite ? inviteState(invite) : null;
    if (invite && state === 'open') return invite;
    if (state === 'withdrawn')
      throw new AppError(
        410,
        'invite_withdrawn',
        'This invitation was withdrawn by the team owner.',
      );
    throw new BadRequestError(
      state === 'accepted'
        ? 'This invitation has already been used.'
        : state === 'expired'
          ? 'This invitation has expired.'
          : 'This invitation link is not valid.',
      'invalid_token',
    );
  }

  async preview(token: string): Promise<InvitePreview> {
    const invite = await this.openInvite(token);
    const team = await this.ds.getRepository(Team).findOneByOrFail({ id: invite.teamId });
    const by = await this.ds.getRepository(User).findOneByOrFail({ id: invite.invitedById });
    return {
      teamName: team.name,
      role: invite.role as Role,
      email: invite.email,
      invitedBy: by.name,
      expiresAt: iso(invite.expiresAt),
    };
  }

  /** Joins the team with the invited role; the link works once. */
  async accept(userId: string, token: string): Promise<TeamDto> {
    const invite = await this.ds.transaction((em) => this.spend(em, userId, token));
    return this.teams.get(userId, invite.teamId);
  }

  /**
   * Spends the invite and adds the membership inside the caller's transaction (sign-up runs it
   * with the new account, so either both happen or neither).
   */
  async spend(em: EntityManager, userId: string, token: string): Promise<Invite> {
    const invite = await this.openInvite(token, em);
    const already = await em.getRepository(Membership).findOneBy({ teamId: invite.teamId, userId });
    if (already) throw new ConflictError('You are already in this team.', 'already_member');
    // Spent only if still open: a withdrawal or another acceptance in between wins.
    const spent = await em
      .getRepository(Invite)
      .update(
        { id: invite.id, acceptedAt: IsNull(), withdrawnAt: IsNull() },
        { acceptedAt: Date.now(), acceptedById: userId },
      );
    if (!spent.affected) {
      await this.openInvite(token, em); // throws why it is no longer open
      throw new BadRequestError('This invitation was just used.', 'invalid_token');
    }
    await em
      .getRepository(Membership)
      .insert({ teamId: invite.teamId, userId, role: invite.role, joinedAt: Date.now() });
    return invite;
  }
}
