import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { csvLog, flightBody, sha256 } from '../helpers/fixtures';
import { aircraft, flight, has, uploaderFor, roleMatrix, type Case } from '../helpers/roles-matrix';

const cases: Case[] = [
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
        .set('cookie', c.ownerCookie)
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
    name: 'ask for a review of a flight they uploaded',
    method: 'post',
    setup: async (c) => ({
      path: `/api/flights/${await flight(c, uploaderFor(c))}/review-request`,
      body: { userIds: [c.ids.coach] },
    }),
    allowed: (r) => has(r, 'upload flights'),
  },
  {
    name: "ask for a review of someone else's flight",
    method: 'post',
    setup: async (c) => ({
      path: `/api/flights/${await flight(c, c.ids.owner === c.callerId ? c.ids.tuner : c.ids.owner)}/review-request`,
      body: { userIds: [c.ids.coach] },
    }),
    allowed: (r) => has(r, 'request reviews of any flight'),
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

roleMatrix('flights, raw logs and reviews', cases);
