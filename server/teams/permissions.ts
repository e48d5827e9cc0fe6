import { can, type Action } from '../../shared/auth/permissions';
import type { Role } from '../../shared/schemas/common';
import { ForbiddenError } from '../http/errors';

export function assertCan(role: Role, action: Action, message?: string): void {
  if (!can(role, action)) throw new ForbiddenError(message);
}
