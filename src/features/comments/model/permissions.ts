import { can, canOnRecord } from '../../../../shared/auth/permissions';
import type { Role } from '../../../../shared/schemas/common';

export interface CommentRights {
  canComment: boolean;
  canResolve: boolean;
  canRequestReview: boolean;
  /** Edit one's own comments: the role's right now, not authorship alone. */
  canEditOwn: boolean;
  canDeleteOwn: boolean;
  canDeleteAny: boolean;
}

/**
 * What the rail shows, from the shared roles table (the server checks it again): viewers read
 * only; coaches, tuners and owners resolve; a pilot resolves, and asks for a review, on their own
 * flights only. Editing or deleting one's own comment follows the current role, so a member
 * demoted to viewer loses it.
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
    // The server refuses a pilot's request on a flight someone else flew; owners and tuners ask for any.
    canRequestReview:
      member && canOnRecord(role, 'flights.requestReviewAny', 'flights.requestReview', ownFlight),
    canEditOwn: member && can(role, 'comments.editOwn'),
    canDeleteOwn: member && can(role, 'comments.deleteOwn'),
    canDeleteAny: member && can(role, 'comments.deleteAny'),
  };
}
