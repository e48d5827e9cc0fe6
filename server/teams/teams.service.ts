import { randomUUID } from 'node:crypto';
import type { DataSource } from 'typeorm';
import type { Action } from '../../shared/auth/permissions';
import type { Role } from '../../shared/schemas/common';
import type { Member, Team as TeamDto } from '../../shared/schemas/teams';
import { User } from '../auth/user.entity';
import { cachedQuery } from '../db/sql';
import { ConflictError, NotFoundError } from '../http/errors';
import { iso } from '../util';
import { Membership } from './membership.entity';
import { assertCan } from './permissions';
import { Team } from './team.entity';

/** Teams, their members and roles; every other service asks `authorize` before it acts. */
export class TeamsService {
  constructor(private readonly ds: DataSource) {}

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
}
