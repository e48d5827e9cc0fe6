import { MemoryStore, type Options, type Store } from 'express-rate-limit';

/**
 * How many mails of one kind a person may cause per window (mentions, review requests), kept
 * in an express-rate-limit store so a shared store can replace the in-process one.
 */
export class MailQuota {
  constructor(
    readonly limit: number,
    readonly windowMs: number,
    private readonly store: Store = new MemoryStore(),
  ) {
    void store.init?.({ windowMs } as Options);
  }

  /** Counts `n` more mails for `key`; false once that goes over the limit. */
  async take(key: string, n = 1): Promise<boolean> {
    let hits = 0;
    for (let i = 0; i < n; i++) hits = (await this.store.increment(key)).totalHits;
    return hits <= this.limit;
  }

  /** Whether `n` more would still fit, without counting them. */
  async fits(key: string, n: number): Promise<boolean> {
    const info = await this.store.get?.(key);
    // rate-limit-redis 6 reads Redis's nil (a key never counted) as NaN through ioredis.
    const hits = Number.isFinite(info?.totalHits) ? info!.totalHits : 0;
    return hits + n <= this.limit;
  }
}
