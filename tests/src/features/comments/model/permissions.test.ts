import { describe, expect, it } from 'vitest';
import { commentRights } from '../../../../../src/features/comments/model/permissions';

describe('comment rights in the rail', () => {
  it('lets a pilot resolve on their own flight only', () => {
    expect(commentRights('pilot', 'u1', 'u1').canResolve).toBe(true);
    expect(commentRights('pilot', 'u1', 'u2').canResolve).toBe(false);
    expect(commentRights('pilot', 'u1', null).canResolve).toBe(false);
  });

  it('lets coaches, tuners and owners resolve on any flight', () => {
    for (const role of ['coach', 'tuner', 'owner'] as const)
      expect([role, commentRights(role, 'u1', 'u2').canResolve]).toEqual([role, true]);
  });

  it('gives a viewer read only', () => {
    expect(commentRights('viewer', 'u1', 'u1')).toEqual({
      canComment: false,
      canResolve: false,
      canRequestReview: false,
      canEditOwn: false,
      canDeleteOwn: false,
      canDeleteAny: false,
    });
  });

  it('gives nothing to someone signed out or outside the team', () => {
    expect(commentRights(null, 'u1', 'u1')).toEqual({
      canComment: false,
      canResolve: false,
      canRequestReview: false,
      canEditOwn: false,
      canDeleteOwn: false,
      canDeleteAny: false,
    });
    expect(commentRights('owner', null, null).canComment).toBe(false);
  });

  it('keeps requesting review to those who upload and deleting others’ comments to the owner', () => {
    expect(commentRights('coach', 'u1', 'u2').canRequestReview).toBe(false);
    expect(commentRights('pilot', 'u1', 'u1').canRequestReview).toBe(true);
    expect(commentRights('pilot', 'u1', 'u2').canRequestReview).toBe(false);
    expect(commentRights('tuner', 'u1', 'u2').canRequestReview).toBe(true);
    expect(commentRights('tuner', 'u1', 'u2').canDeleteAny).toBe(false);
    expect(commentRights('owner', 'u1', 'u2').canDeleteAny).toBe(true);
  });

  it('lets own comments be edited and deleted only while the role still comments', () => {
    for (const role of ['owner', 'tuner', 'pilot', 'coach'] as const) {
      const r = commentRights(role, 'u1', 'u2');
      expect([role, r.canEditOwn, r.canDeleteOwn]).toEqual([role, true, true]);
    }
    // A member demoted to viewer keeps authorship but not the right.
    const viewer = commentRights('viewer', 'u1', 'u2');
    expect([viewer.canEditOwn, viewer.canDeleteOwn]).toEqual([false, false]);
  });
});
