import { randomUUID } from 'node:crypto';
import { defaultThresholds } from '../../../shared/schemas/thresholds';
import { extraMember, has, roleMatrix, type Case } from '../helpers/roles-matrix';

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
];

roleMatrix('the team, members, invitations and thresholds', cases);
