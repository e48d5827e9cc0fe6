import type { Role } from '../../shared/schemas/common';
import { ForbiddenError } from '../http/errors';

const everyone: readonly Role[] = ['owner', 'tuner', 'pilot', 'coach', 'viewer'];

/**
 * What each role may do, from the roles table of the product design. Anything not listed is
 * denied. Ownership rules (a pilot's own flight, one's own comment) are checked by the services
 * on top of these.
 */
export const permissions = {
  'team.read': everyone,
  'team.update': ['owner'],
  'members.manage': ['owner'],
  'invites.manage': ['owner'],
  'thresholds.update': ['owner', 'tuner'],
  // A pilot importing an unfamiliar log layout saves its column map for the next import.
  'presets.write': ['owner', 'tuner', 'pilot'],
  'presets.delete': ['owner', 'tuner'],
  'aircraft.create': ['owner', 'tuner'],
  'aircraft.update': ['owner', 'tuner'],
  'aircraft.delete': ['owner'],
  'serviceLog.create': ['owner', 'tuner', 'pilot'],
  'benchRuns.create': ['owner', 'tuner'],
  'flights.upload': ['owner', 'tuner', 'pilot'],
  'flights.replaceAny': ['owner'],
  'flights.deleteAny': ['owner'],
  'flights.requestReview': ['owner', 'tuner', 'pilot'],
  'flights.review': ['owner', 'coach'],
  'comments.create': ['owner', 'tuner', 'pilot', 'coach'],
  'comments.resolveAny': ['owner', 'tuner', 'coach'],
  'comments.resolveOnOwnFlight': ['pilot'],
  'comments.deleteAny': ['owner'],
} as const satisfies Record<string, readonly Role[]>;

export type Action = keyof typeof permissions;

export function can(role: Role, action: Action): boolean {
  return (permissions[action] as readonly Role[]).includes(role);
}

export function assertCan(role: Role, action: Action, message?: string): void {
  if (!can(role, action)) throw new ForbiddenError(message);
}
