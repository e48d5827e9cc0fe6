// @vitest-environment jsdom
import { QueryClient } from '@tanstack/react-query';
import { afterEach, describe, expect, it } from 'vitest';
import { persistQueries, restoreQueries } from '../../../src/app/query-persistence';
import { presetKeys } from '../../../src/api/presets';

afterEach(() => localStorage.clear());

describe('query persistence', () => {
  it('brings team lists back after a reload and leaves details, flights and reviews out', async () => {
    const before = new QueryClient();
    const stop = persistQueries(before, localStorage, 0);
    before.setQueryData(['aircraft', 'list', 'team-1'], { aircraft: [{ id: 'a1', name: 'Kite' }] });
    before.setQueryData(presetKeys.team('team-1'), { presets: [] });
    before.setQueryData(['aircraft', 'detail', 'a1', 'service-log'], { entries: [] });
    before.setQueryData(['teams', 'detail', 'team-1', 'members'], { members: [] });
    before.setQueryData(['review', 'flight', 'f1'], { big: true });
    before.setQueryData(['flights', 'list', 'team-1', {}], { pages: [] });
    stop();

    const after = new QueryClient();
    restoreQueries(after, localStorage);
    expect(after.getQueryData(['aircraft', 'list', 'team-1'])).toEqual({
      aircraft: [{ id: 'a1', name: 'Kite' }],
    });
    expect(after.getQueryData(presetKeys.team('team-1'))).toEqual({ presets: [] });
    expect(after.getQueryData(['aircraft', 'detail', 'a1', 'service-log'])).toBeUndefined();
    expect(after.getQueryData(['teams', 'detail', 'team-1', 'members'])).toBeUndefined();
    expect(after.getQueryData(['review', 'flight', 'f1'])).toBeUndefined();
    expect(after.getQueryData(['flights', 'list', 'team-1', {}])).toBeUndefined();
  });

  it('starts empty when what was stored cannot be read', () => {
    localStorage.setItem('hoverprint.query-cache.v1', '{not json');
    const client = new QueryClient();
    restoreQueries(client, localStorage);
    expect(client.getQueryCache().getAll()).toEqual([]);
    expect(localStorage.getItem('hoverprint.query-cache.v1')).toBeNull();
  });
});
