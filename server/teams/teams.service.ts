import { randomUUID } from 'node:crypto';
import { In, IsNull, type DataSource, type EntityManager } from 'typeorm';
import type { Role } from '../../shared/schemas/common';
import type {
  Invite as InviteDto,
  InviteInput,
  InvitePreview,
  InviteState,
  Member,
  Team as TeamDto,
} from '../../shared/schemas/teams';
import { User } from '../auth/user.entity';
import { hashToken, newToken } from '../auth/tokens';
import type { Config } from '../config';
import { AppError, BadRequestError, ConflictError, NotFoundError } from '../http/errors';
import type { Mailer } from '../mail/mailer';
import { inviteMail, inviteUrl } from '../mail/templates';
import { iso, isoOrNull } from '../util';
import { cachedQuery } from '../db/sql';
import { withUserNames } from '../db/with-user-names';
import { limits } from '../limits';
import { Invite } from './invite.entity';
import { Membership } from './membership.entity';
import type { Action } from '../../shared/auth/permissions';
import { assertCan } from './permissions';
import { Team } from './team.entity';

const INVITE_TTL_MS = 7 * 24 * 60 * 60 * 1000;

/** Accepted and withdrawn are final; an invite nobody used runs out after its week. */
export function inviteState(i: Invite, now = Date.now()): InviteState {
  if (i.acceptedAt !== null) return 'accepted';
  if (i.withdrawnAt !== null) return 'withdrawn';
  return i.expiresAt <= now ? 'expired' : 'open';
}

export class TeamsService {
  constructor(
    private readonly ds: DataSource,
    private readonly config: Pick<Config, 'publicUrl'>,
    private readonly mailer: Mailer,
  ) {}

  /** The caller's role in the team; 404 for outsiders so a team's existence does not leak. */
  async roleIn(userId: string, teamId: string): Promise<Role> {
    const [m] = await this.roleQuery({ teamId, userId });
    if (!m) throw new NotFoundError('Team');
    return m.role;
  }

  private readonly roleQuery = cachedQuery<{ teamId: string; userId: string }, { role: Role }>(
    this.ds,
    (p) =>
      this.ds
        .getRepository(Membership)
        .createQueryBuilder('m')
        .select('m.role', 'role')
        .where('m.teamId = :teamId AND m.userId = :userId', { teamId: p.teamId, userId: p.userId }),
  );

  /** Role check in one call: 404 for outsiders, 403 when the role may not do it. */
  async authorize(userId: string, teamId: string, action: Action): Promise<Role> {
    const role = await this.roleIn(userId, teamId);
    assertCan(role, action);
    return role;
  }

  private async toDto(teamId: string, role: Role): Promise<TeamDto> {
    const team = await this.ds.getRepository(Team).findOneBy({ id: teamId });
    if (!team) throw new NotFoundError('Team');
    const memberCount = await this.ds.getRepository(Membership).countBy({ teamId });
    return { id: team.id, name: team.name, role, memberCount, createdAt: iso(team.createdAt) };
  }

  async list(userId: string): Promise<TeamDto[]> {
    const rows = await this.ds
      .getRepository(Membership)
      .createQueryBuilder('m')
      .innerJoin(Team, 't', 't.id = m.teamId')
      .select(['t.id AS id', 't.name AS name', 'm.role AS role', 't.createdAt AS "createdAt"'])
      .addSelect(
        (q) => q.select('COUNT(*)').from(Membership, 'mc').where('mc.teamId = t.id'),
        'memberCount',
      )
      .where('m.userId = :userId', { userId })
      .orderBy('t.name')
      .getRawMany<{
        id: string;
        name: string;
        role: Role;
        createdAt: number;
        memberCount: number;
      }>();
    return rows.map((r) => ({
      ...r,
      memberCount: Number(r.memberCount),
      createdAt: iso(Number(r.createdAt)),
    }));
  }

  async create(userId: string, name: string): Promise<TeamDto> {
    const id = randomUUID();
    const now = Date.now();
    await this.ds.transaction(async (em) => {
      await em
        .getRepository(Team)
        .insert({ id, name, thresholds: null, thresholdsUpdatedAt: null, createdAt: now });
      await em
        .getRepository(Membership)
        .insert({ teamId: id, userId, role: 'owner', joinedAt: now });
    });
    return this.toDto(id, 'owner');
  }

  async get(userId: string, teamId: string): Promise<TeamDto> {
    return this.toDto(teamId, await this.authorize(userId, teamId, 'team.read'));
  }

  async rename(userId: string, teamId: string, name: string): Promise<TeamDto> {
    const role = await this.authorize(userId, teamId, 'team.update');
    await this.ds.getRepository(Team).update({ id: teamId }, { name });
    return this.toDto(teamId, role);
  }

  async members(userId: string, teamId: string): Promise<Member[]> {
    await this.authorize(userId, teamId, 'team.read');
    const rows = await this.ds
      .getRepository(Membership)
      .createQueryBuilder('m')
      .innerJoin(User, 'u', 'u.id = m.userId')
      .select([
        'u.id AS "userId"',
        'u.name AS name',
        'u.email AS email',
        'm.role AS role',
        'm.joinedAt AS "joinedAt"',
      ])
      .where('m.teamId = :teamId', { teamId })
      .orderBy('u.name')
      .getRawMany<{ userId: string; name: string; email: string; role: Role; joinedAt: number }>();
    return rows.map((r) => ({ ...r, joinedAt: iso(Number(r.joinedAt)) }));
  }

  private async owners(teamId: string) {
    return this.ds.getRepository(Membership).countBy({ teamId, role: 'owner' });
  }

  async setRole(actorId: string, teamId: string, userId: string, role: Role): Promise<Member> {
    await this.authorize(actorId, teamId, 'members.manage');
    const repo = this.ds.getRepository(Membership);
    const m = await repo.findOneBy({ teamId, userId });
    if (!m) throw new NotFoundError('Member');
    if (m.role === 'owner' && role !== 'owner' && (await this.owners(teamId)) <= 1) {
      throw new ConflictError(
        'A team needs at least one owner. Make someone else owner first.',
        'last_owner',
      );
    }
    await repo.update({ teamId, userId }, { role });
    const member = (await this.members(actorId, teamId)).find((x) => x.userId === userId);
    if (!member) throw new NotFoundError('Member');
    return member;
  }

  /** The owner removes anyone; any member may remove themself (leave). */
  async removeMember(actorId: string, teamId: string, userId: string): Promise<void> {
    if (actorId !== userId) await this.authorize(actorId, teamId, 'members.manage');
    else await this.roleIn(actorId, teamId);
    const repo = this.ds.getRepository(Membership);
    const m = await repo.findOneBy({ teamId, userId });
    if (!m) throw new NotFoundError('Member');
    if (m.role === 'owner' && (await this.owners(teamId)) <= 1) {
      throw new ConflictError(
        'The last owner cannot leave. Make someone else owner first.',
        'last_owner',
      );
    }
    await repo.delete({ teamId, userId });
  }

  /** Invites an address; `created` is false when it already had an open invitation. */
  async invite(
    actorId: string,
    teamId: string,
    input: InviteInput,
  ): Promise<{ invite: InviteDto; created: boolean }> {
    await this.authorize(actorId, teamId, 'invites.manage');
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

  async invites(actorId: string, teamId: string): Promise<InviteDto[]> {
    await this.authorize(actorId, teamId, 'invites.manage');
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
  async withdrawInvite(actorId: string, teamId: string, inviteId: string): Promise<void> {
    await this.authorize(actorId, teamId, 'invites.manage');
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

  async previewInvite(token: string): Promise<InvitePreview> {
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
  async acceptInvite(userId: string, token: string): Promise<TeamDto> {
    const invite = await this.ds.transaction((em) => this.spendInvite(em, userId, token));
    return this.toDto(invite.teamId, invite.role as Role);
  }

  /**
   * Spends the invite and adds the membership inside the caller's transaction (sign-up runs it
   * with the new account, so either both happen or neither).
   */
  async spendInvite(em: EntityManager, userId: string, token: string): Promise<Invite> {
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
