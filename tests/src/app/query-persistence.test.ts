// @vitest-environment jsdom
import { QueryClient } from '@tanstack/react-query';
import { afterEach, describe, expect, it } from 'vitest';
import { isKept, persistQueries, restoreQueries } from '../../../src/app/query-persistence';
import { flightKeys } from '../../../src/api/flight-keys';
import { mailKeys } from '../../../src/api/mail';
import { presetKeys } from '../../../src/api/presets';
import { teamKeys } from '../../../src/api/teams';

afterEach(() => localStorage.clear());

describe('query persistence', () => {
  it('brings team lists back after a reload and leaves details and reviews out', async () => {
    const before = new QueryClient();
    const stop = persistQueries(before, localStorage, 0);
    before.setQueryData(['aircraft', 'list', 'team-1'], { aircraft: [{ id: 'a1', name: 'Kite' }] });
    before.setQueryData(presetKeys.team('team-1'), { presets: [] });
    before.setQueryData(['aircraft', 'detail', 'a1', 'service-log'], { entries: [] });
    before.setQueryData(teamKeys.members('team-1'), { members: [{ userId: 'u1' }] });
    before.setQueryData(teamKeys.thresholds('team-1'), { version: 3 });
    before.setQueryData(['review', 'flight', 'f1'], { big: true });
    before.setQueryData(flightKeys.detail('f1'), { big: true });
    before.setQueryData(flightKeys.list('team-1', {}), { pages: [{ flights: [] }] });
    before.setQueryData(flightKeys.awaiting('team-1'), { flights: [] });
    before.setQueryData(mailKeys.available(), true);
    before.setQueryData(mailKeys.inbox(), { messages: [] });
    stop();

    const after = new QueryClient();
    restoreQueries(after, localStorage);
    expect(after.getQueryData(['aircraft', 'list', 'team-1'])).toEqual({
      aircraft: [{ id: 'a1', name: 'Kite' }],
    });
    expect(after.getQueryData(presetKeys.team('team-1'))).toEqual({ presets: [] });
    // Offline, the fleet and the team page show what they showed last, not errors.
    expect(after.getQueryData(teamKeys.members('team-1'))).toEqual({ members: [{ userId: 'u1' }] });
    expect(after.getQueryData(teamKeys.thresholds('team-1'))).toEqual({ version: 3 });
    expect(after.getQueryData(flightKeys.list('team-1', {}))).toEqual({ pages: [{ flights: [] }] });
    expect(after.getQueryData(flightKeys.awaiting('team-1'))).toEqual({ flights: [] });
    // The inbox link stays in the navigation offline; the messages themselves are read fresh.
    expect(after.getQueryData(mailKeys.available())).toBe(true);
    expect(after.getQueryData(mailKeys.inbox())).toBeUndefined();
    expect(after.getQueryData(['aircraft', 'detail', 'a1', 'service-log'])).toBeUndefined();
    expect(after.getQueryData(['review', 'flight', 'f1'])).toBeUndefined();
    expect(after.getQueryData(flightKeys.detail('f1'))).toBeUndefined();
    // Shown at once, but read again on first use: a change made meanwhile elsewhere shows up.
    expect(after.getQueryState(flightKeys.list('team-1', {}))?.isInvalidated).toBe(true);
    expect(after.getQueryState(teamKeys.members('team-1'))?.isInvalidated).toBe(true);
  });

  it('keeps nothing of a key that only starts like a kept one', () => {
    expect(isKept(['teams', 'detail', 'team-1'])).toBe(false);
    expect(isKept(['teams', 'detail', 'team-1', 'members'])).toBe(true);
    expect(isKept(['teams', 'detail', 'team-1', 'elsewhere'])).toBe(false);
  });

  it('starts empty when what was stored cannot be read', () => {
    localStorage.setItem('hoverprint.query-cache.v1', '{not json');
    const client = new QueryClient();
    restoreQueries(client, localStorage);
    expect(client.getQueryCache().getAll()).toEqual([]);
    expect(localStorage.getItem('hoverprint.query-cache.v1')).toBeNull();
  });
});
