import { kite } from '../helpers/fixtures';
import {
  aircraft,
  benchRun,
  has,
  serviceEvent,
  roleMatrix,
  type Case,
} from '../helpers/roles-matrix';

const cases: Case[] = [
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
];

roleMatrix('aircraft, service log, bench runs and trends', cases);
