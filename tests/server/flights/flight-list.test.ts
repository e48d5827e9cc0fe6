import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Flight } from '../../../server/flights/flight.entity';
import { User } from '../../../server/auth/user.entity';
import { Membership } from '../../../server/teams/membership.entity';
import {
  FlightListQuery,
  FlightPage,
  type FlightListQueryInput,
} from '../../../shared/schemas/flights';
import { engine } from '../helpers/engine';
import { watchSql } from '../helpers/sql-watch';
import { describeStep, explainPostgres, type PgPlanStep } from '../helpers/explain';
import { kite } from '../helpers/fixtures';
import { startTestApp, type TestApp } from '../helpers/test-app';

/**
 * The flight list with every filter the fleet page offers: the right flights in the right
 * order across pages, and a query plan that seeks an index instead of scanning or sorting.
 */
describe('flight list', () => {
  let t: TestApp;
  let ownerId: string;
  let pilotId: string;
  let teamId: string;
  let kiteId: string;
  let heronId: string;
  const all: Flight[] = [];

  beforeAll(async () => {
    t = await startTestApp();
    const s = t.services;
    ownerId = await s.auth.signUp({
      email: 'mara@crew.example',
      password: 'long enough pass',
      name: 'Mara',
    });
    teamId = (await s.teams.create(ownerId, 'Club and filming crew')).id;
    pilotId = randomUUID();
    await t.dataSource.getRepository(User).insert({
      id: pilotId,
      email: 'pia@crew.example',
      name: 'Pia',
      passwordHash: 'x',
      commentMail: true,
      createdAt: 0,
    });
    await t.dataSource
      .getRepository(Membership)
      .insert({ teamId, userId: pilotId, role: 'pilot', joinedAt: 0 });
    kiteId = (await s.aircraft.create(ownerId, teamId, kite)).id;
    heronId = (await s.aircraft.create(ownerId, teamId, { ...kite, name: 'Heron' })).id;
    // 60 flights, several recorded in the same minute, so pages split runs of equal times.
    const states = ['none', 'requested', 'reviewed', 'changes-requested'];
    for (let i = 0; i < 60; i++) {
      all.push({
        id: randomUUID(),
        teamId,
        aircraftId: i % 3 ? kiteId : heronId,
        pilotId: i % 2 ? pilotId : ownerId,
        recordedAt: Date.UTC(2026, 4, 1) + Math.floor(i / 4) * 60_000,
        durationS: 30,
        sampleRateHz: 2000,
        fileName: `flight-${i}.csv`,
        sha256: i.toString(16).padStart(64, '0'),
        sizeBytes: 1000,
        rawKey: null,
        rawGzip: false,
        reportVersion: 1,
        trend: '{}',
        worstSeverity: i % 4,
        noteCount: 0,
        watchCount: 0,
        actCount: 0,
        commentCount: i % 5 === 0 ? 2 : 0,
        openComments: i % 5 === 0 ? 1 : 0,
        reviewState: states[i % 7 === 0 ? 1 : i % 3 === 0 ? 2 : i % 11 === 0 ? 3 : 0]!,
        note: '',
        createdAt: 0,
        updatedAt: 0,
      });
    }
    await t.dataSource.getRepository(Flight).insert(all);
    // Statistics, as autovacuum would have gathered them by now on a live database.
    if (engine === 'postgres') await t.dataSource.query('ANALYZE flights');
  });
  afterAll(() => t.close());

  const day = (minutes: number) => new Date(Date.UTC(2026, 4, 1) + minutes * 60_000).toISOString();
  const filters: Record<string, () => FlightListQueryInput> = {
    aircraft: () => ({ aircraftId: heronId }),
    pilot: () => ({ pilotId }),
    'date range': () => ({ from: day(3), to: day(11) }),
    'from a date': () => ({ from: day(5) }),
    'until a date': () => ({ to: day(9) }),
    'open comments': () => ({ openComments: 'true' }),
    'no open comments': () => ({ openComments: 'false' }),
    'at least note': () => ({ severity: 'note' }),
    'at least watch': () => ({ severity: 'watch' }),
    'act only': () => ({ severity: 'act' }),
    'awaiting review': () => ({ review: 'requested' }),
    reviewed: () => ({ review: 'reviewed' }),
    'changes requested': () => ({ review: 'changes-requested' }),
    'not reviewed': () => ({ review: 'none' }),
  };
  /** Which of the 60 flights a filter should keep, written out independently of the SQL. */
  function expected(q: FlightListQueryInput) {
    const rank = { note: 1, watch: 2, act: 3 };
    return all
      .filter(
        (f) =>
          (!q.aircraftId || f.aircraftId === q.aircraftId) &&
          (!q.pilotId || f.pilotId === q.pilotId) &&
          (!q.from || f.recordedAt >= Date.parse(q.from)) &&
          (!q.to || f.recordedAt < Date.parse(q.to)) &&
          (q.openComments === undefined ||
            (q.openComments === 'true' ? f.openComments > 0 : f.openComments === 0)) &&
          (!q.severity || f.worstSeverity >= rank[q.severity]) &&
          (!q.review || f.reviewState === q.review),
      )
      .sort((a, b) => b.recordedAt - a.recordedAt || (a.id < b.id ? 1 : a.id > b.id ? -1 : 0))
      .map((f) => f.id);
  }
  /** Two filters of different kinds, the way people narrow the list. */
  function pairs() {
    const kind = (n: string) =>
      /comments/.test(n)
        ? 'open'
        : /note|watch|act/.test(n)
          ? 'sev'
          : /review|changes/.test(n)
            ? 'review'
            : /date/.test(n)
              ? 'date'
              : n;
    const names = Object.keys(filters);
    return names.flatMap((a, i) =>
      names
        .slice(i + 1)
        .filter((b) => kind(a) !== kind(b))
        .map((b) => [a, b] as const),
    );
  }
  const combos = () => [
    ['no filter'] as const,
    ...Object.keys(filters).map((n) => [n] as const),
    ...pairs(),
  ];
  const queryOf = (names: readonly string[]) =>
    Object.assign(
      {},
      ...names.filter((n) => n in filters).map((n) => filters[n]!()),
    ) as FlightListQueryInput;

  async function walk(q: FlightListQueryInput, limit: number) {
    const ids: string[] = [];
    let cursor: string | null = null;
    do {
      const page = FlightPage.parse(
        await t.services.flights.list(
          ownerId,
          teamId,
          FlightListQuery.parse({ ...q, limit, ...(cursor ? { cursor } : {}) }),
        ),
      );
      expect(page.flights.length).toBeLessThanOrEqual(limit);
      ids.push(...page.flights.map((f) => f.id));
      cursor = page.nextCursor;
    } while (cursor);
    return ids;
  }

  it('pages every filter and every pair of filters newest first, each flight once', async () => {
    for (const names of combos()) {
      const q = queryOf(names);
      const want = expected(q);
      expect(await walk(q, 3), names.join(' + ')).toEqual(want);
    }
  });

  it('keeps flights recorded at the same moment apart across a page boundary', async () => {
    // Four flights share each minute; pages of 3 cut through every run of equal times.
    const ids = await walk({}, 3);
    expect(ids).toEqual(expected({}));
    expect(ids).toHaveLength(60);
  });

  it('counts each aircraft’s flights and those awaiting review for the fleet cards', async () => {
    const cards = await t.services.aircraft.list(ownerId, teamId);
    for (const card of cards) {
      const mine = all.filter((f) => f.aircraftId === card.id);
      expect(card.flightCount, card.name).toBe(mine.length);
      expect(card.awaitingReview, card.name).toBe(
        mine.filter((f) => f.reviewState === 'requested').length,
      );
      expect(card.awaitingReview, card.name).toBeGreaterThan(0);
    }
    expect(cards.map((c) => c.name)).toEqual(['Heron', 'Kite']);
  });

  /** The list query's SQL and parameters, as the service sends them. */
  async function listSql(q: FlightListQueryInput, withCursor: boolean) {
    const first = await t.services.flights.list(
      ownerId,
      teamId,
      FlightListQuery.parse({ ...q, limit: 2 }),
    );
    const watch = watchSql(t.dataSource);
    try {
      await t.services.flights.list(
        ownerId,
        teamId,
        FlightListQuery.parse({
          ...q,
          limit: 2,
          ...(withCursor && first.nextCursor ? { cursor: first.nextCursor } : {}),
        }),
      );
      const call = watch.calls.find(([sql]) => /FROM "flights"/.test(sql));
      expect(call, 'the list query').toBeDefined();
      const [sql, params] = call! as [string, unknown[]];
      return { sql, params };
    } finally {
      watch.restore();
    }
  }

  async function plan(q: FlightListQueryInput, withCursor: boolean) {
    const { sql, params } = await listSql(q, withCursor);
    const rows = (await t.dataSource.query(`EXPLAIN QUERY PLAN ${sql}`, params)) as {
      detail: string;
    }[];
    return rows.map((r) => r.detail);
  }

  async function pgPlan(q: FlightListQueryInput, withCursor: boolean) {
    const { sql, params } = await listSql(q, withCursor);
    return explainPostgres(t.dataSource, sql, params);
  }

  const flightsStep = (steps: PgPlanStep[]) => steps.find((s) => s.relation === 'flights');

  it.runIf(engine === 'sqlite')(
    'seeks an index for every filter and pair, with or without a cursor, and never sorts',
    async () => {
      for (const names of combos()) {
        for (const withCursor of [false, true]) {
          const steps = await plan(queryOf(names), withCursor);
          const label = `${names.join(' + ')}${withCursor ? ' (cursor)' : ''}: ${steps.join(' | ')}`;
          const flights = steps.find(
            (d) => / f /.test(` ${d} `) || d.startsWith('SEARCH f') || d.startsWith('SCAN f'),
          );
          expect(flights, label).toMatch(/^SEARCH f USING INDEX idx_flights_/);
          expect(steps.join(' '), label).not.toMatch(/TEMP B-TREE|SCAN f\b/);
        }
      }
    },
  );

  it.runIf(engine === 'postgres')(
    'seeks an index for every filter and pair on PostgreSQL, with or without a cursor, and never sorts',
    async () => {
      for (const names of combos()) {
        for (const withCursor of [false, true]) {
          const steps = await pgPlan(queryOf(names), withCursor);
          const label = `${names.join(' + ')}${withCursor ? ' (cursor)' : ''}: ${steps.map(describeStep).join(' | ')}`;
          expect(flightsStep(steps)?.type, label).toMatch(/^Index (Only )?Scan/);
          expect(flightsStep(steps)?.index, label).toMatch(/^idx_flights_/);
          expect(
            steps.map((s) => s.type),
            label,
          ).not.toContain('Sort');
          expect(
            steps.map((s) => s.type),
            label,
          ).not.toContain('Seq Scan');
        }
      }
    },
  );

  const want: Record<string, string> = {
    'no filter': 'idx_flights_team_recorded',
    aircraft: 'idx_flights_team_aircraft_recorded',
    pilot: 'idx_flights_team_pilot_recorded',
    'date range': 'idx_flights_team_recorded',
    'open comments': 'idx_flights_team_open_recorded',
    'at least watch': 'idx_flights_team_watch_recorded',
    'act only': 'idx_flights_team_act_recorded',
    'awaiting review': 'idx_flights_team_review_recorded',
    reviewed: 'idx_flights_team_review_recorded',
  };

  it.runIf(engine === 'postgres')(
    'uses the index made for each single filter on PostgreSQL',
    async () => {
      for (const [name, index] of Object.entries(want)) {
        const f = flightsStep(await pgPlan(queryOf([name]), true))!;
        // An aircraft belongs to one team, so its own (aircraftId, recordedAt, id) index serves
        // that filter just as well. Half the team's flights here are the pilot's, so walking
        // the team's list in order and skipping the others is as cheap as the pilot index;
        // PostgreSQL's statistics see that and may take either (both seek, neither sorts).
        const alternatives: Record<string, string> = {
          aircraft: 'idx_flights_aircraft_recorded',
          pilot: 'idx_flights_team_recorded',
        };
        const fine = [index, alternatives[name]];
        expect(fine, name).toContain(f.index);
        // The cursor is part of the seek, not a filter applied to every newer row.
        if (name !== 'date range') expect(f.cond, name).toMatch(/ROW\("recordedAt", id\) < ROW/);
      }
    },
  );

  it.runIf(engine === 'sqlite')('uses the index made for each single filter', async () => {
    for (const [name, index] of Object.entries(want)) {
      const steps = await plan(queryOf([name]), true);
      const f = steps.find((d) => d.startsWith('SEARCH f'))!;
      expect(f, name).toContain(`USING INDEX ${index} `);
      // The cursor is part of the seek, not a filter applied to every newer row.
      if (name !== 'date range') expect(f, name).toContain('(recordedAt,id)<(?,?)');
    }
  });
});
