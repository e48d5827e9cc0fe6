import { describe, expect, it, vi } from 'vitest';
import {
  createSyncScheduler,
  OFFLINE_RETRY_MS,
} from '../../../../src/features/sync/sync-scheduler';
import type { SyncDeps, SyncPassResult } from '../../../../src/features/sync/sync-runner';

const idle: SyncPassResult = {
  flightsSynced: 0,
  writesSent: 0,
  refused: 0,
  conflicts: 0,
  deferred: 0,
  waiting: 0,
  stoppedBy: null,
  nextRetryAt: null,
};
const deps: SyncDeps = {
  fetch: vi.fn() as unknown as typeof fetch,
  now: () => 0,
  defaultTeamId: () => undefined,
};

describe('sync scheduler', () => {
  it('runs nothing until enabled, and one pass at a time however often it is kicked', async () => {
    let release: () => void = () => {};
    const run = vi.fn(
      () =>
        new Promise<SyncPassResult>((resolve) => {
          release = () => resolve(idle);
        }),
    );
    const scheduler = createSyncScheduler(deps, { run });
    scheduler.kick();
    expect(run).not.toHaveBeenCalled();

    scheduler.setEnabled(true);
    expect(run).toHaveBeenCalledTimes(1);
    scheduler.kick();
    scheduler.kick();
    expect(run).toHaveBeenCalledTimes(1);
    expect(scheduler.getState().running).toBe(true);

    // Kicks during a pass ask for exactly one more pass afterwards.
    release();
    await vi.waitFor(() => expect(run).toHaveBeenCalledTimes(2));
    release();
    await vi.waitFor(() => expect(scheduler.getState().running).toBe(false));
    expect(run).toHaveBeenCalledTimes(2);
    scheduler.stop();
  });

  it('looks again later when the server could not be reached', async () => {
    vi.useFakeTimers();
    try {
      const run = vi
        .fn<(d: SyncDeps) => Promise<SyncPassResult>>()
        .mockResolvedValueOnce({ ...idle, stoppedBy: 'offline' })
        .mockResolvedValue(idle);
      const scheduler = createSyncScheduler(deps, { run });
      scheduler.setEnabled(true);
      await vi.advanceTimersByTimeAsync(OFFLINE_RETRY_MS - 1);
      expect(run).toHaveBeenCalledTimes(1);
      await vi.advanceTimersByTimeAsync(1);
      expect(run).toHaveBeenCalledTimes(2);
      scheduler.stop();
    } finally {
      vi.useRealTimers();
    }
  });

  it('comes back when the earliest back-off is due', async () => {
    vi.useFakeTimers();
    try {
      const run = vi
        .fn<(d: SyncDeps) => Promise<SyncPassResult>>()
        .mockResolvedValueOnce({ ...idle, deferred: 1, nextRetryAt: 4_000 })
        .mockResolvedValue(idle);
      const scheduler = createSyncScheduler(deps, { run });
      scheduler.setEnabled(true);
      await vi.advanceTimersByTimeAsync(3_999);
      expect(run).toHaveBeenCalledTimes(1);
      await vi.advanceTimersByTimeAsync(1);
      expect(run).toHaveBeenCalledTimes(2);
      scheduler.stop();
    } finally {
      vi.useRealTimers();
    }
  });
});
