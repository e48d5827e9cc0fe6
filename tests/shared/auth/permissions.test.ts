import { describe, expect, it } from 'vitest';
import { can, permissions, type Action } from '../../../shared/auth/permissions';
import { Role } from '../../../shared/schemas/common';

// The full role × route matrix is checked against the running server in
// tests/server/<area>/roles.test.ts; here only what the UI leans on besides it.
describe('roles table', () => {
  it('grants nothing to someone without a role in the team', () => {
    for (const action of Object.keys(permissions) as Action[]) {
      expect([action, can(undefined, action)]).toEqual([action, false]);
      expect([action, can(null, action)]).toEqual([action, false]);
    }
  });

  it('lets the owner do everything and the viewer only read', () => {
    for (const action of Object.keys(permissions) as Action[]) {
      // The owner resolves anywhere through comments.resolveAny; the own-flight rule is the pilot's.
      const ownerMay = action !== 'comments.resolveOnOwnFlight';
      expect([action, can('owner', action)]).toEqual([action, ownerMay]);
      expect([action, can('viewer', action)]).toEqual([action, action === 'team.read']);
    }
  });

  it('follows the roles table for a few telling cases', () => {
    expect(can('coach', 'aircraft.update')).toBe(false);
    expect(can('pilot', 'serviceLog.create')).toBe(true);
    expect(can('tuner', 'thresholds.update')).toBe(true);
    expect(can('pilot', 'comments.resolveAny')).toBe(false);
    expect(can('pilot', 'comments.resolveOnOwnFlight')).toBe(true);
  });

  it('names only known roles', () => {
    for (const roles of Object.values(permissions))
      for (const role of roles) expect(Role.options).toContain(role);
  });
});
