import { describe, expect, it } from 'vitest';
import { headerStatus, type SyncCounts } from '../../../src/lib/header-status';

const none: SyncCounts = {
  flights: 0,
  changes: 0,
  conflicts: 0,
  needsAttention: 0,
  running: false,
};

describe('header status model', () => {
  it('never says the server is online without a network, whatever it last answered', () => {
    const s = headerStatus(false, 'answering', { ...none, flights: 1 });
    expect(s.network).toBe('offline');
    expect(s.server).toMatchObject({ label: 'Server out of reach', answering: false });
    expect(s.sync.label).toBe('Offline · 1 flight not synced');
  });

  it('reads online, answering and nothing waiting as all synced', () => {
    const s = headerStatus(true, 'answering', none);
    expect([s.server.label, s.sync.label, s.sync.tone]).toEqual([
      'Server online',
      'All synced',
      'ok',
    ]);
  });

  it('counts what waits, changes and conflicts, and marks a conflict as needing a person', () => {
    const s = headerStatus(true, 'answering', {
      flights: 2,
      changes: 1,
      conflicts: 1,
      needsAttention: 1,
      running: false,
    });
    expect(s.sync.label).toBe('2 flights not synced · 1 change queued · 1 conflict to resolve');
    expect(s.sync.tone).toBe('bad');
  });

  it('says syncing only while our server answers', () => {
    expect(headerStatus(true, 'answering', { ...none, flights: 1, running: true }).sync.label).toBe(
      'Syncing…',
    );
    const down = headerStatus(true, 'not-answering', { ...none, flights: 1, running: true });
    expect([down.server.label, down.sync.label]).toEqual([
      'Server not answering',
      '1 flight not synced',
    ]);
  });

  it('waits for the first answer before judging the server', () => {
    expect(headerStatus(true, 'checking', undefined).server.label).toBe('Checking server…');
  });
});
