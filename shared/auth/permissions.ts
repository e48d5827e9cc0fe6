import type { Role } from '../schemas/common';

const everyone: readonly Role[] = ['owner', 'tuner', 'pilot', 'coach', 'viewer'];

/**
 * What each role may do (the roles table in server/README.md). Anything not listed is
 * denied. Ownership rules (a pilot's own flight, one's own comment) are checked on top of these.
 * The server enforces this table on every request; the UI reads the same table only to hide
 * what a role cannot do.
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
  // Correcting the record: whoever edits aircraft removes any service event; a pilot only their own.
  'serviceLog.deleteAny': ['owner', 'tuner'],
  'serviceLog.deleteOwn': ['owner', 'pilot'],
  'benchRuns.create': ['owner', 'tuner'],
  'benchRuns.delete': ['owner', 'tuner'],
  'flights.upload': ['owner', 'tuner', 'pilot'],
  'flights.replaceAny': ['owner'],
  'flights.deleteAny': ['owner'],
  // Own work follows the current role: a pilot demoted to viewer no longer deletes their flights.
  'flights.deleteOwn': ['owner', 'tuner', 'pilot'],
  // Asking for a review of one's own flight; the owner and tuners ask for any flight.
  'flights.requestReview': ['owner', 'tuner', 'pilot'],
  'flights.requestReviewAny': ['owner', 'tuner'],
  'flights.review': ['owner', 'coach'],
  'comments.create': ['owner', 'tuner', 'pilot', 'coach'],
  'comments.resolveAny': ['owner', 'tuner', 'coach'],
  'comments.resolveOnOwnFlight': ['pilot'],
  'comments.deleteAny': ['owner'],
  // Editing or deleting one's own comment needs a role that may still write comments.
  'comments.editOwn': ['owner', 'tuner', 'pilot', 'coach'],
  'comments.deleteOwn': ['owner', 'tuner', 'pilot', 'coach'],
} as const satisfies Record<string, readonly Role[]>;

export type Action = keyof typeof permissions;

/** Whether the role may take the action; someone with no role in the team may do nothing. */
export function can(role: Role | null | undefined, action: Action): boolean {
  return role != null && (permissions[action] as readonly Role[]).includes(role);
}

/**
 * Whether the role may act on one record: on any record with `anyAction`, or with `ownAction`
 * on a record that is the user's own (the flight they uploaded, the comment they wrote).
 */
export function canOnRecord(
  role: Role | null | undefined,
  anyAction: Action,
  ownAction: Action,
  own: boolean,
): boolean {
  return can(role, anyAction) || (own && can(role, ownAction));
}

/** Whether `userId`, with `role` in the team, may delete a service event `addedById` logged. */
export function canDeleteServiceEntry(
  role: Role | null | undefined,
  userId: string,
  addedById: string,
): boolean {
  return canOnRecord(role, 'serviceLog.deleteAny', 'serviceLog.deleteOwn', userId === addedById);
}
