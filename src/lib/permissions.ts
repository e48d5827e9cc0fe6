import type { Role } from '../../shared/schemas/common';

/**
 * What each role may do, from the roles table of the product design; the same action names
 * and lists as server/teams/permissions.ts. The UI only hides what a role cannot do; the server
 * checks every request on its own.
 */
const everyone: readonly Role[] = ['owner', 'tuner', 'pilot', 'coach', 'viewer'];

const permissions = {
  'team.read': everyone,
  'team.update': ['owner'],
  'members.manage': ['owner'],
  'invites.manage': ['owner'],
  'thresholds.update': ['owner', 'tuner'],
  'presets.write': ['owner', 'tuner', 'pilot'],
  'presets.delete': ['owner', 'tuner'],
  'aircraft.create': ['owner', 'tuner'],
  'aircraft.update': ['owner', 'tuner'],
  'aircraft.delete': ['owner'],
  'serviceLog.create': ['owner', 'tuner', 'pilot'],
  'benchRuns.create': ['owner', 'tuner'],
  'flights.upload': ['owner', 'tuner', 'pilot'],
  'comments.create': ['owner', 'tuner', 'pilot', 'coach'],
} as const satisfies Record<string, readonly Role[]>;

export type Action = keyof typeof permissions;

export function can(role: Role | undefined, action: Action): boolean {
  return role !== undefined && (permissions[action] as readonly Role[]).includes(role);
}

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
