import type { Role } from '../../../../shared/schemas/common';

export interface CommentRights {
  canComment: boolean;
  canResolve: boolean;
  canRequestReview: boolean;
  canDeleteAny: boolean;
}

/**
 * What the rail shows, from the role table of the product design (the server checks it again):
 * viewers read only; coaches, tuners and owners resolve; a pilot resolves on their own flights.
 */
export function commentRights(
  role: Role | null,
  meId: string | null,
  pilotId: string | null,
): CommentRights {
  const member = role !== null && meId !== null;
  return {
    canComment: member && role !== 'viewer',
    canResolve:
      member &&
      (role === 'owner' ||
        role === 'tuner' ||
        role === 'coach' ||
        (role === 'pilot' && pilotId !== null && pilotId === meId)),
    canRequestReview: member && (role === 'owner' || role === 'tuner' || role === 'pilot'),
    canDeleteAny: role === 'owner',
  };
}
