import type { Store } from 'express-rate-limit';
import { Redis } from 'ioredis';
import { RedisStore, type RedisReply } from 'rate-limit-redis';
import type { Config } from '../config';

/** Where the rate limiters keep their counters. */
export interface RateLimitStores {
  /**
   * The store for the limiter called `name` (one per limiter: express-rate-limit refuses to share
   * one). Undefined means express-rate-limit's own in-memory store, counted per process.
   */
  store(name: string): Store | undefined;
  close(): Promise<void>;
}

/**
 * Counters in Redis when REDIS_URL is set, so a limit holds across every server process; else
 * in memory. Keys are scoped by the database name, so two installs may share one Redis. The
 * client connects on first use, so a CLI that never limits anything opens no connection.
 */
export function createRateLimitStores(
  config: Pick<Config, 'redisUrl' | 'databaseUrl'>,
): RateLimitStores {
  const url = config.redisUrl;
  if (url === undefined) return { store: () => undefined, close: async () => undefined };
  const scope = config.databaseUrl
    ? decodeURIComponent(new URL(config.databaseUrl).pathname.slice(1)) || 'default'
    : 'default';
  let client: Redis | undefined;
  return {
    store(name) {
      client ??= new Redis(url, { lazyConnect: false });
      const c = client;
      return new RedisStore({
        prefix: `hoverprint:${scope}:rl:${name}:`,
        sendCommand: (command: string, ...args: string[]) =>
          c.call(command, ...args) as Promise<RedisReply>,
      });
    },
    async close() {
      if (client) await client.quit().catch(() => client?.disconnect());
    },
  };
}
