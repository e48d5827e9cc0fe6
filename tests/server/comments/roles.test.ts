import { randomUUID } from 'node:crypto';
import { comment, flight, has, roleMatrix, type Case } from '../helpers/roles-matrix';

const cases: Case[] = [
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
];

roleMatrix('comments', cases);
