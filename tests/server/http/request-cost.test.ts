import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { FlightPage } from '../../../shared/schemas/flights';
import { flightBody, kite } from '../helpers/fixtures';
import { watchSql } from '../helpers/sql-watch';
import { signedUpAgent, startTestApp, type TestApp } from '../helpers/test-app';
import { randomUUID } from 'node:crypto';

// Count password hashing without changing it: the real argon2, watched.
const argon2 = vi.hoisted(() => ({ hash: 0, verify: 0 }));
vi.mock('@node-rs/argon2', async (importOriginal) => {
  const real = await importOriginal<typeof import('@node-rs/argon2')>();
  return {
    ...real,
    hash: (...args: Parameters<typeof real.hash>) => {
      argon2.hash++;
      return real.hash(...args);
    },
    verify: (...args: Parameters<typeof real.verify>) => {
      argon2.verify++;
      return real.verify(...args);
    },
  };
});

/** What a signed-in request costs beyond its own work (list pages are hot: tests/bench/README.md §1.4). */
describe('request cost', () => {
  let t: TestApp;
  let owner: Awaited<ReturnType<typeof signedUpAgent>>;
  let teamId: string;

  beforeAll(async () => {
    t = await startTestApp();
    owner = await signedUpAgent(t.app, 'Mara');
    teamId = (await t.services.teams.create(owner.id, 'Club and filming crew')).id;
    const aircraft = await t.services.aircraft.create(owner.id, teamId, kite);
    for (let i = 0; i < 5; i++)
      await t.services.flights.put(owner.id, randomUUID(), flightBody(teamId, aircraft.id));
  });
  afterAll(() => t.close());

  it('checks the session without hashing the password', async () => {
    expect(argon2.hash).toBeGreaterThan(0); // signing up did hash: the watch works
    const before = { ...argon2 };
    for (let i = 0; i < 5; i++) {
      await owner.agent.get(`/api/teams/${teamId}/flights`).expect(200);
      await owner.agent.get('/api/auth/me').expect(200);
    }
    expect(argon2).toEqual(before);
  });

  it('serves a page of flights with three queries: the session, the role and the page', async () => {
    const first = FlightPage.parse(
      (await owner.agent.get(`/api/teams/${teamId}/flights`).query({ limit: 2 }).expect(200)).body,
    );
    const watch = watchSql(t.dataSource);
    try {
      await owner.agent
        .get(`/api/teams/${teamId}/flights`)
        .query({ limit: 2, cursor: first.nextCursor!, severity: 'watch' })
        .expect(200);
      const sql = watch.calls.map(([q]) => q);
      expect(sql, sql.join('\n')).toHaveLength(3);
      expect(sql[0]).toMatch(/FROM "sessions"/);
      expect(sql[1]).toMatch(/FROM "memberships"/);
      expect(sql[2]).toMatch(/FROM "flights"/);
    } finally {
      watch.restore();
    }
  });
});
