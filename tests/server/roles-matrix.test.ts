import { randomUUID } from 'node:crypto';
import request from 'supertest';
import type { Agent } from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiErrorBody } from '../../shared/api/error';
import { defaultThresholds } from '../../shared/schemas/thresholds';
import type { Role } from '../../shared/schemas/common';
import { User } from '../../server/auth/user.entity';
import { Membership } from '../../server/teams/membership.entity';
import { csvLog, flightBody, kite, sha256 } from './helpers/fixtures';
import { signedUpAgent, startTestApp, type TestApp } from './helpers/test-app';

/**
 * The roles table of the product design (PRODUCT.md §2), written out as capabilities:
 *   owner  — everything, incl. members, roles, invites, team settings, deleting anything
 *   tuner  — edit aircraft, airframes, bench runs, thresholds; upload flights; comment; resolve
 *   pilot  — upload own flights, add service events to aircraft, comment, resolve on own
 *            flights, delete own flights
 *   coach  — view all, comment, resolve, request changes; no edits to aircraft
 *   viewer — read only
 * Two readings the table leaves open, decided here and in the server alike: whoever uploaded a
 * flight may delete it (the team-server issue: "by owner or by the pilot who uploaded it"), and
 * a tuner, who edits aircraft, may add service events too. Import presets are saved by anyone
 * who imports flights. Correcting the aircraft record: whoever edits aircraft (owner, tuner)
 * deletes any service event or bench run; a pilot deletes only the service events they added.
 */
type Capability =
  | 'view'
  | 'manage team'
  | 'delete anything'
  | 'edit aircraft'
  | 'bench runs'
  | 'thresholds'
  | 'upload flights'
  | 'service events'
  | 'comment'
  | 'resolve'
  | 'resolve on own flights'
  | 'delete own flights'
  | 'request changes'
  | 'save import presets'
  | 'delete import presets';

const roles: Role[] = ['owner', 'tuner', 'pilot', 'coach', 'viewer'];
const table: Record<Role, Capability[] | 'everything'> = {
  owner: 'everything',
  tuner: [
    'view',
    'edit aircraft',
    'bench runs',
    'thresholds',
    'upload flights',
    'service events',
    'comment',
    'resolve',
    'delete own flights',
    'save import presets',
    'delete import presets',
  ],
  pilot: [
    'view',
    'upload flights',
    'service events',
    'comment',
    'resolve on own flights',
    'delete own flights',
    'save import presets',
  ],
  coach: ['view', 'comment', 'resolve', 'request changes'],
  viewer: ['view'],
};
const has = (role: Role, cap: Capability) =>
  table[role] === 'everything' || table[role].includes(cap);

type Caller = Role | 'outsider' | 'anonymous';

interface Ctx {
  t: TestApp;
  teamId: string;
  ids: Record<Role | 'outsider', string>;
  caller: Caller;
  callerId: string;
}

interface Case {
  name: string;
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  /** Builds the resources the call needs and returns path and body. */
  setup: (c: Ctx) => Promise<{ path: string; body?: unknown }>;
  /** Roles the table allows. */
  allowed: (role: Role) => boolean;
}

const canUpload = (c: Ctx) =>
  c.caller !== 'outsider' && c.caller !== 'anonymous' && has(c.caller, 'upload flights');

async function aircraft(c: Ctx) {
  return c.t.services.aircraft.create(c.ids.owner, c.teamId, kite);
}
async function flight(c: Ctx, uploaderId: string) {
  const a = await aircraft(c);
  const id = randomUUID();
  await c.t.services.flights.put(uploaderId, id, flightBody(c.teamId, a.id));
  return id;
}
async function comment(c: Ctx, authorId: string, flightId: string) {
  const id = randomUUID();
  await c.t.services.comments.put(authorId, id, {
    flightId,
    tS: 12.5,
    body: 'Motor 1 sounds rough here',
  });
  return id;
}
async function extraMember(c: Ctx, role: Role) {
  const id = randomUUID();
  await c.t.dataSource.getRepository(User).insert({
    id,
    email: `${id}@crew.example`,
    name: 'Extra',
    passwordHash: 'x',
    commentMail: true,
    createdAt: Date.now(),
  });
  await c.t.dataSource
    .getRepository(Membership)
    .insert({ teamId: c.teamId, userId: id, role, joinedAt: Date.now() });
  return id;
}
const uploaderFor = (c: Ctx) => (canUpload(c) ? c.callerId : c.ids.owner);
const serviceEvent = {
  date: '2026-05-03',
  kind: 'prop-change' as const,
  motor: 2,
  note: 'New props after a tree strike',
};
const benchRun = {
  date: '2026-05-03',
  motor: '2207 1950 kV',
  prop: '5.1x3.6x3',
  rows: [
    { throttle: 0.5, thrustG: 600, currentA: 12 },
    { throttle: 1, thrustG: 1650, currentA: 42 },
  ],
};

const cases: Case[] = [
  {
    name: 'read the team',
    method: 'get',
    setup: async (c) => ({ path: `/api/teams/${c.teamId}` }),
    allowed: (r) => has(r, 'view'),
  },
  {
    name: 'rename the team',
    method: 'patch',
    setup: async (c) => ({ path: `/api/teams/${c.teamId}`, body: { name: 'Field crew' } }),
    allowed: (r) => has(r, 'manage team'),
  },
  {
    name: 'list members',
    method: 'get',
    setup: async (c) => ({ path: `/api/teams/${c.teamId}/members` }),
    allowed: (r) => has(r, 'view'),
  },
  {
    name: "change someone's role",
    method: 'patch',
    setup: async (c) => ({
      path: `/api/teams/${c.teamId}/members/${await extraMember(c, 'viewer')}`,
      body: { role: 'coach' },
    }),
    allowed: (r) => has(r, 'manage team'),
  },
  {
    name: 'remove a member',
    method: 'delete',
    setup: async (c) => ({
      path: `/api/teams/${c.teamId}/members/${await extraMember(c, 'viewer')}`,
    }),
    allowed: (r) => has(r, 'manage team'),
  },
  {
    name: 'invite someone',
    method: 'post',
    setup: async (c) => ({
      path: `/api/teams/${c.teamId}/invites`,
      body: { email: `${randomUUID()}@crew.example`, role: 'pilot' },
    }),
    allowed: (r) => has(r, 'manage team'),
  },
  {
    name: 'withdraw an invite',
    method: 'delete',
    setup: async (c) => {
      const { invite } = await c.t.services.invites.create(c.ids.owner, c.teamId, {
        email: `${randomUUID()}@crew.example`,
        role: 'pilot',
      });
      return { path: `/api/teams/${c.teamId}/invites/${invite.id}` };
    },
    allowed: (r) => has(r, 'manage team'),
  },
  {
    name: 'list invites',
    method: 'get',
    setup: async (c) => ({ path: `/api/teams/${c.teamId}/invites` }),
    allowed: (r) => has(r, 'manage team'),
  },
  {
    name: 'read thresholds',
    method: 'get',
    setup: async (c) => ({ path: `/api/teams/${c.teamId}/thresholds` }),
    allowed: (r) => has(r, 'view'),
  },
  {
    name: 'set thresholds',
    method: 'put',
    setup: async (c) => ({
      path: `/api/teams/${c.teamId}/thresholds`,
      body: { ...defaultThresholds, motorWatchPct: 7 },
    }),
    allowed: (r) => has(r, 'thresholds'),
  },
  {
    name: 'list import presets',
    method: 'get',
    setup: async (c) => ({ path: `/api/teams/${c.teamId}/presets` }),
    allowed: (r) => has(r, 'view'),
  },
  {
    name: 'save an import preset',
    method: 'post',
    setup: async (c) => ({
      path: `/api/teams/${c.teamId}/presets`,
      body: {
        name: `Preset ${randomUUID()}`,
        columnMap: { columns: { t_ms: { channel: 'time', unit: 'ms' } } },
      },
    }),
    allowed: (r) => has(r, 'save import presets'),
  },
  {
    name: 'delete an import preset',
    method: 'delete',
    setup: async (c) => {
      const p = await c.t.services.presets.create(c.ids.owner, c.teamId, {
        name: `P ${randomUUID()}`,
        columnMap: { columns: { t: { channel: 'time' } } },
      });
      return { path: `/api/presets/${p.id}` };
    },
    allowed: (r) => has(r, 'delete import presets'),
  },
  {
    name: 'list aircraft',
    method: 'get',
    setup: async (c) => ({ path: `/api/teams/${c.teamId}/aircraft` }),
    allowed: (r) => has(r, 'view'),
  },
  {
    name: 'add an aircraft',
    method: 'post',
    setup: async (c) => ({ path: `/api/teams/${c.teamId}/aircraft`, body: kite }),
    allowed: (r) => has(r, 'edit aircraft'),
  },
  {
    name: 'read an aircraft',
    method: 'get',
    setup: async (c) => ({ path: `/api/aircraft/${(await aircraft(c)).id}` }),
    allowed: (r) => has(r, 'view'),
  },
  {
    name: 'edit an airframe',
    method: 'patch',
    setup: async (c) => ({
      path: `/api/aircraft/${(await aircraft(c)).id}`,
      body: { airframe: { ...kite.airframe, massG: 700 } },
    }),
    allowed: (r) => has(r, 'edit aircraft'),
  },
  {
    name: 'delete an aircraft',
    method: 'delete',
    setup: async (c) => ({ path: `/api/aircraft/${(await aircraft(c)).id}` }),
    allowed: (r) => has(r, 'delete anything'),
  },
  {
    name: 'read the service log',
    method: 'get',
    setup: async (c) => ({ path: `/api/aircraft/${(await aircraft(c)).id}/service-log` }),
    allowed: (r) => has(r, 'view'),
  },
  {
    name: 'add a service event',
    method: 'post',
    setup: async (c) => ({
      path: `/api/aircraft/${(await aircraft(c)).id}/service-log`,
      body: {
        date: '2026-05-03',
        kind: 'prop-change',
        motor: 2,
        note: 'New props after a tree strike',
      },
    }),
    allowed: (r) => has(r, 'service events'),
  },
  {
    name: "delete someone else's service event",
    method: 'delete',
    setup: async (c) => {
      const a = await aircraft(c);
      const by = c.callerId === c.ids.owner ? c.ids.tuner : c.ids.owner;
      const e = await c.t.services.aircraft.addServiceEntry(by, a.id, serviceEvent);
      return { path: `/api/aircraft/${a.id}/service-log/${e.id}` };
    },
    allowed: (r) => has(r, 'edit aircraft'),
  },
  {
    name: 'delete a service event they added',
    method: 'delete',
    setup: async (c) => {
      const a = await aircraft(c);
      const mayAdd =
        c.caller !== 'outsider' && c.caller !== 'anonymous' && has(c.caller, 'service events');
      const by = mayAdd ? c.callerId : c.ids.owner;
      const e = await c.t.services.aircraft.addServiceEntry(by, a.id, serviceEvent);
      return { path: `/api/aircraft/${a.id}/service-log/${e.id}` };
    },
    allowed: (r) => has(r, 'service events'),
  },
  {
    name: 'read bench runs',
    method: 'get',
    setup: async (c) => ({ path: `/api/aircraft/${(await aircraft(c)).id}/bench-runs` }),
    allowed: (r) => has(r, 'view'),
  },
  {
    name: 'add a bench run',
    method: 'post',
    setup: async (c) => ({
      path: `/api/aircraft/${(await aircraft(c)).id}/bench-runs`,
      body: {
        date: '2026-05-03',
        motor: '2207 1950 kV',
        prop: '5.1x3.6x3',
        rows: [
          { throttle: 0.5, thrustG: 600, currentA: 12 },
          { throttle: 1, thrustG: 1650, currentA: 42 },
        ],
      },
    }),
    allowed: (r) => has(r, 'bench runs'),
  },
  {
    name: 'delete a bench run',
    method: 'delete',
    setup: async (c) => {
      const a = await aircraft(c);
      const run = await c.t.services.aircraft.addBenchRun(c.ids.owner, a.id, benchRun);
      return { path: `/api/aircraft/${a.id}/bench-runs/${run.id}` };
    },
    allowed: (r) => has(r, 'bench runs'),
  },
  {
    name: 'read trends',
    method: 'get',
    setup: async (c) => ({ path: `/api/aircraft/${(await aircraft(c)).id}/trends` }),
    allowed: (r) => has(r, 'view'),
  },
  {
    name: 'list flights',
    method: 'get',
    setup: async (c) => ({ path: `/api/teams/${c.teamId}/flights` }),
    allowed: (r) => has(r, 'view'),
  },
  {
    name: 'upload a flight',
    method: 'put',
    setup: async (c) => ({
      path: `/api/flights/${randomUUID()}`,
      body: flightBody(c.teamId, (await aircraft(c)).id),
    }),
    allowed: (r) => has(r, 'upload flights'),
  },
  {
    name: 'read a flight',
    method: 'get',
    setup: async (c) => ({ path: `/api/flights/${await flight(c, c.ids.pilot)}` }),
    allowed: (r) => has(r, 'view'),
  },
  {
    name: 'download a raw log',
    method: 'get',
    setup: async (c) => {
      const a = await aircraft(c);
      const id = randomUUID();
      const csv = csvLog(id);
      await c.t.services.flights.put(
        c.ids.owner,
        id,
        flightBody(c.teamId, a.id, { sha256: sha256(csv) }),
      );
      await request(c.t.app)
        .put(`/api/flights/${id}/raw`)
        .set('cookie', ownerCookie)
        .attach('file', Buffer.from(csv), 'log.csv')
        .expect(201);
      return { path: `/api/flights/${id}/raw` };
    },
    allowed: (r) => has(r, 'view'),
  },
  {
    name: "delete someone else's flight",
    method: 'delete',
    setup: async (c) => ({
      path: `/api/flights/${await flight(c, c.ids.owner === c.callerId ? c.ids.tuner : c.ids.owner)}`,
    }),
    allowed: (r) => has(r, 'delete anything'),
  },
  {
    name: 'delete a flight they uploaded',
    method: 'delete',
    setup: async (c) => ({ path: `/api/flights/${await flight(c, uploaderFor(c))}` }),
    allowed: (r) => has(r, 'delete own flights') || has(r, 'delete anything'),
  },
  {
    name: 'read comments',
    method: 'get',
    setup: async (c) => ({ path: `/api/flights/${await flight(c, c.ids.pilot)}/comments` }),
    allowed: (r) => has(r, 'view'),
  },
  {
    name: 'comment',
    method: 'put',
    setup: async (c) => ({
      path: `/api/comments/${randomUUID()}`,
      body: { flightId: await flight(c, c.ids.pilot), tS: 3.2, body: 'Yaw wobble here' },
    }),
    allowed: (r) => has(r, 'comment'),
  },
  {
    name: "resolve a thread on the owner's flight",
    method: 'patch',
    setup: async (c) => ({
      path: `/api/comments/${await comment(c, c.ids.owner, await flight(c, c.ids.owner))}`,
      body: { resolved: true },
    }),
    allowed: (r) => has(r, 'resolve'),
  },
  {
    name: "resolve a thread on the pilot's own flight",
    method: 'patch',
    setup: async (c) => ({
      path: `/api/comments/${await comment(c, c.ids.coach, await flight(c, c.ids.pilot))}`,
      body: { resolved: true },
    }),
    allowed: (r) => has(r, 'resolve') || has(r, 'resolve on own flights'),
  },
  {
    name: "edit the owner's comment",
    method: 'patch',
    setup: async (c) => ({
      path: `/api/comments/${await comment(c, c.ids.owner, await flight(c, c.ids.pilot))}`,
      body: { body: 'edited' },
    }),
    allowed: (r) => r === 'owner', // only the author edits
  },
  {
    name: "delete the owner's comment",
    method: 'delete',
    setup: async (c) => ({
      path: `/api/comments/${await comment(c, c.ids.owner, await flight(c, c.ids.pilot))}`,
    }),
    allowed: (r) => has(r, 'delete anything'), // the owner is the author here
  },
  {
    name: 'ask for a review of a flight they uploaded',
    method: 'post',
    setup: async (c) => ({
      path: `/api/flights/${await flight(c, uploaderFor(c))}/review-request`,
      body: { userIds: [c.ids.coach] },
    }),
    allowed: (r) => has(r, 'upload flights'),
  },
  {
    name: 'request changes on a flight',
    method: 'post',
    setup: async (c) => ({
      path: `/api/flights/${await flight(c, c.ids.pilot)}/review`,
      body: { state: 'changes-requested', note: 'Rebalance props' },
    }),
    allowed: (r) => has(r, 'request changes'),
  },
];

let ownerCookie = '';

describe('role × route matrix (PRODUCT.md §2)', () => {
  let t: TestApp;
  let teamId: string;
  const agents = {} as Record<Role | 'outsider', Agent>;
  const ids = {} as Record<Role | 'outsider', string>;

  beforeAll(async () => {
    t = await startTestApp();
    for (const who of [...roles, 'outsider'] as const) {
      const s = await signedUpAgent(t.app, who[0]!.toUpperCase() + who.slice(1));
      agents[who] = s.agent;
      ids[who] = s.id;
    }
    const res = await agents.owner.post('/api/auth/sign-in').send({
      email: (await t.services.auth.me(ids.owner)).email,
      password: 'correct horse battery',
    });
    ownerCookie = res.headers['set-cookie']![0]!.split(';')[0]!;
    teamId = (await t.services.teams.create(ids.owner, 'Club and filming crew')).id;
    for (const role of roles.filter((r) => r !== 'owner')) {
      await t.dataSource
        .getRepository(Membership)
        .insert({ teamId, userId: ids[role], role, joinedAt: Date.now() });
    }
    // The outsider runs a team of their own.
    await t.services.teams.create(ids.outsider, 'Another crew');
  });
  afterAll(() => t.close());

  const callers: Caller[] = [...roles, 'outsider', 'anonymous'];
  for (const k of cases) {
    describe(k.name, () => {
      for (const caller of callers) {
        const expected =
          caller === 'anonymous'
            ? '401'
            : caller === 'outsider'
              ? '404 or 403'
              : k.allowed(caller)
                ? 'allowed'
                : '403';
        it(`${caller}: ${expected}`, async () => {
          const callerId = caller === 'anonymous' ? '' : ids[caller];
          const { path, body } = await k.setup({ t, teamId, ids, caller, callerId });
          const client = caller === 'anonymous' ? request(t.app) : agents[caller];
          const req = client[k.method](path);
          const res = body === undefined ? await req : await req.send(body as object);
          if (expected === 'allowed') {
            expect(res.status, JSON.stringify(res.body)).toBeGreaterThanOrEqual(200);
            expect(res.status, JSON.stringify(res.body)).toBeLessThan(300);
          } else {
            const want = expected === '401' ? [401] : expected === '403' ? [403] : [403, 404];
            expect(want, `${res.status} ${JSON.stringify(res.body)}`).toContain(res.status);
            ApiErrorBody.parse(res.body);
          }
        });
      }
    });
  }
});
