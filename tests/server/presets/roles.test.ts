import { randomUUID } from 'node:crypto';
import { has, roleMatrix, type Case } from '../helpers/roles-matrix';

const cases: Case[] = [
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
];

roleMatrix('import presets', cases);
