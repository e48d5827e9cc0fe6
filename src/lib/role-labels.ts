import type { Role } from '../../shared/schemas/common';

export const roleLabels: Record<Role, string> = {
  owner: 'Owner',
  tuner: 'Tuner',
  pilot: 'Pilot',
  coach: 'Coach',
  viewer: 'Viewer',
};

export const roleDescriptions: Record<Role, string> = {
  owner: 'Everything, including members, roles, invites and team settings.',
  tuner: 'Edits aircraft, airframes, bench runs and thresholds; uploads flights.',
  pilot: 'Uploads own flights, logs service work, saves import presets, comments.',
  coach: 'Reads everything, comments, resolves and requests changes; no aircraft edits.',
  viewer: 'Reads only.',
};
