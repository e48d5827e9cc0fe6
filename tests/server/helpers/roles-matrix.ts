import { randomUUID } from 'node:crypto';
import request from 'supertest';
import type { Agent } from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiErrorBody } from '../../../shared/api/error';
import type { Role } from '../../../shared/schemas/common';
import { User } from '../../../server/auth/user.entity';
import { Membership } from '../../../server/teams/membership.entity';
import { flightBody, kite } from './fixtures';
import { signedUpAgent, startTestApp, type TestApp } from './test-app';

/**
 * The roles table (server/README.md, "Roles and permissions"), written out as capabilities:
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
  | 'request reviews of any flight'
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
    'request reviews of any flight',
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
export const has = (role: Role, cap: Capability) =>
  table[role] === 'everything' || table[role].includes(cap);

type Caller = Role | 'outsider' | 'anonymous';

export interface Ctx {
  t: TestApp;
  /** The owner's session cookie, for setups that upload through HTTP. */
  ownerCookie: string;
  teamId: string;
  ids: Record<Role | 'outsider', string>;
  caller: Caller;
  callerId: string;
}

export interface Case {
  name: string;
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  /** Builds the resources the call needs and returns path and body. */
  setup: (c: Ctx) => Promise<{ path: string; body?: unknown }>;
  /** Roles the table allows. */
  allowed: (role: Role) => boolean;
}

const canUpload = (c: Ctx) =>
  c.caller !== 'outsider' && c.caller !== 'anonymous' && has(c.caller, 'upload flights');

export async function aircraft(c: Ctx) {
  return c.t.services.aircraft.create(c.ids.owner, c.teamId, kite);
}
export async function flight(c: Ctx, uploaderId: string) {
  const a = await aircraft(c);
  const id = randomUUID();
  await c.t.services.flights.put(uploaderId, id, flightBody(c.teamId, a.id));
  return id;
}
export async function comment(c: Ctx, authorId: string, flightId: string) {
  const id = randomUUID();
  await c.t.services.comments.put(authorId, id, {
    flightId,
    tS: 12.5,
    body: 'Motor 1 sounds rough here',
  });
  return id;
}
export async function extraMember(c: Ctx, role: Role) {
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
export const uploaderFor = (c: Ctx) => (canUpload(c) ? c.callerId : c.ids.owner);
export const serviceEvent = {
  date: '2026-05-03',
  kind: 'prop-change' as const,
  motor: 2,
  note: 'New props after a tree strike',
};
export const benchRun = {
  date: '2026-05-03',
  motor: '2207 1950 kV',
  prop: '5.1x3.6x3',
  rows: [
    { throttle: 0.5, thrustG: 600, currentA: 12 },
    { throttle: 1, thrustG: 1650, currentA: 42 },
  ],
};

/**
 * Runs every case for every caller (each role, an outsider from another team, and nobody):
 * allowed calls answer 2xx, the rest 401, 403 or (for outsiders) 404, in the one error shape.
 */
export function roleMatrix(title: string, cases: Case[]) {
  describe(`role × route matrix: ${title}`, () => {
    let t: TestApp;
    let teamId: string;
    let ownerCookie = '';
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
            const { path, body } = await k.setup({ t, ownerCookie, teamId, ids, caller, callerId });
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
}
