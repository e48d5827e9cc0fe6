import type { Adapter, DatabaseSession, DatabaseUser } from 'lucia';
import { LessThanOrEqual, type DataSource } from 'typeorm';
import { cachedQuery } from '../db/sql';
import { Session } from './session.entity';
import { User } from './user.entity';

/**
 * Lucia v3 adapter over our TypeORM entities (the published SQLite adapter does not install
 * alongside better-sqlite3 12). Session expiry is stored in unix seconds.
 */
export class TypeOrmLuciaAdapter implements Adapter {
  constructor(private readonly dataSource: DataSource) {}

  private get sessions() {
    return this.dataSource.getRepository(Session);
  }

  /** Runs on every signed-in request, so its SQL is built once. */
  private readonly sessionAndUser = cachedQuery<
    { sessionId: string },
    {
      sid: string;
      userId: string;
      expiresAt: number;
      email: string;
      name: string;
      commentMail: number;
    }
  >(this.dataSource, (p) =>
    this.dataSource
      .getRepository(Session)
      .createQueryBuilder('s')
      .innerJoin(User, 'u', 'u.id = s.userId')
      .select([
        's.id AS sid',
        's.userId AS "userId"',
        's.expiresAt AS "expiresAt"',
        'u.email AS email',
        'u.name AS name',
        'u.commentMail AS "commentMail"',
      ])
      .where('s.id = :sessionId', { sessionId: p.sessionId }),
  );

  async getSessionAndUser(
    sessionId: string,
  ): Promise<[DatabaseSession | null, DatabaseUser | null]> {
    const [r] = await this.sessionAndUser({ sessionId });
    if (!r) return [null, null];
    return [
      {
        id: r.sid,
        userId: r.userId,
        expiresAt: new Date(Number(r.expiresAt) * 1000),
        attributes: {},
      },
      {
        id: r.userId,
        attributes: { email: r.email, name: r.name, commentMail: Boolean(r.commentMail) },
      },
    ];
  }

  async getUserSessions(userId: string): Promise<DatabaseSession[]> {
    const rows = await this.sessions.findBy({ userId });
    return rows.map((s) => ({
      id: s.id,
      userId: s.userId,
      expiresAt: new Date(s.expiresAt * 1000),
      attributes: {},
    }));
  }

  async setSession(session: DatabaseSession): Promise<void> {
    await this.sessions.insert({
      id: session.id,
      userId: session.userId,
      expiresAt: Math.floor(session.expiresAt.getTime() / 1000),
    });
  }

  async updateSessionExpiration(sessionId: string, expiresAt: Date): Promise<void> {
    await this.sessions.update(
      { id: sessionId },
      { expiresAt: Math.floor(expiresAt.getTime() / 1000) },
    );
  }

  async deleteSession(sessionId: string): Promise<void> {
    await this.sessions.delete({ id: sessionId });
  }

  async deleteUserSessions(userId: string): Promise<void> {
    await this.sessions.delete({ userId });
  }

  async deleteExpiredSessions(): Promise<void> {
    await this.sessions.delete({ expiresAt: LessThanOrEqual(Math.floor(Date.now() / 1000)) });
  }
}
