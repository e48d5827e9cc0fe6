import { describe, expect, it } from 'vitest';
import { Role } from '../../../shared/schemas/common';
import { can as serverCan, permissions } from '../../../server/teams/permissions';
import { can as uiCan, type Action } from '../../../src/lib/permissions';

// The UI hides what a role cannot do; it must hide exactly what the server refuses.
const uiActions: Action[] = [
  'team.read',
  'team.update',
  'members.manage',
  'invites.manage',
  'thresholds.update',
  'presets.write',
  'presets.delete',
  'aircraft.create',
  'aircraft.update',
  'aircraft.delete',
  'serviceLog.create',
  'benchRuns.create',
  'flights.upload',
  'comments.create',
];

describe('role checks in the UI', () => {
  it.each(uiActions)('agree with the server for %s', (action) => {
    expect(action in permissions).toBe(true);
    for (const role of Role.options)
      expect([role, uiCan(role, action)]).toEqual([
        role,
        serverCan(role, action as keyof typeof permissions),
      ]);
  });

  it('show nothing to someone without a role in the team', () => {
    expect(uiCan(undefined, 'team.read')).toBe(false);
  });

  it('follow the roles table for a few telling cases', () => {
    expect(uiCan('coach', 'aircraft.update')).toBe(false);
    expect(uiCan('pilot', 'serviceLog.create')).toBe(true);
    expect(uiCan('viewer', 'comments.create')).toBe(false);
    expect(uiCan('tuner', 'thresholds.update')).toBe(true);
  });
});
