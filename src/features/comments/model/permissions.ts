import { can } from '../../../../shared/auth/permissions';
import type { Role } from '../../../../shared/schemas/common';

export interface CommentRights {
  canComment: boolean;
  canResolve: boolean;
  canRequestReview: boolean;
  canDeleteAny: boolean;
}

/**
 * What the rail shows, from the shared roles table (the server checks it again): viewers read
 * only; coaches, tuners and owners resolve; a pilot resolves on their own flights.
 */
export function commentRights(
  role: Role | null,
  meId: string | null,
  pilotId: string | null,
): CommentRights {
  const member = role !== null && meId !== null;
  const ownFlight = pilotId !== null && pilotId === meId;
  return {
    canComment: member && can(role, 'comments.create'),
    canResolve:
      member &&
      (can(role, 'comments.resolveAny') || (ownFlight && can(role, 'comments.resolveOnOwnFlight'))),
    canRequestReview: member && can(role, 'flights.requestReview'),
    canDeleteAny: can(role, 'comments.deleteAny'),
  };
}
