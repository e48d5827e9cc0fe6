import 'reflect-metadata';
import type { AddressInfo } from 'node:net';
import { LessThan } from 'typeorm';
import { createApp } from './app';
import { Session } from './auth/session.entity';
import { ConfigError, loadConfig, type Config } from './config';
import { engineOf, openDatabase } from './db/data-source';
import { createLogger } from './http/logger';
import { startMailer } from './mail/mailer';
import { createServices } from './services';

export interface RunningServer {
  url: string;
  close: () => Promise<void>;
}

/** Opens the database, applies migrations, starts mail and listens. */
export async function startServer(config: Config): Promise<RunningServer> {
  const logger = createLogger(config);
  const { dataSource, applied } = await openDatabase(config);
  if (applied.length > 0) logger.info({ applied }, 'database migrated');

  const mailer = await startMailer(config.mail, logger);
  const services = createServices(dataSource, config, mailer);
  const swept = await services.rawLogs.sweep();
  if (swept > 0) logger.info({ swept }, 'removed raw logs no flight refers to');
  const app = createApp({ dataSource, config, logger, mailer, services });
  const server = app.listen(config.port, config.host);
  await new Promise<void>((resolveListen, rejectListen) => {
    server.once('listening', resolveListen);
    server.once('error', rejectListen);
  });
  const { port } = server.address() as AddressInfo;
  const url = `http://localhost:${port}`;
  const engine = engineOf(config);
  logger.info(
    {
      url,
      env: config.env,
      database: engine === 'sqlite' ? config.dbPath : 'postgres',
      rawStore: config.s3 ? `s3://${config.s3.bucket}` : 'disk',
      rateLimits: config.redisUrl ? 'redis' : 'memory',
    },
    `Hoverprint listening on ${url}`,
  );

  // Lucia leaves expired sessions in the table; sweep them hourly. With several processes on
  // one database each sweeps: the DELETE is idempotent, so running it twice is harmless.
  const sweep = setInterval(() => {
    dataSource
      .getRepository(Session)
      .delete({ expiresAt: LessThan(Math.floor(Date.now() / 1000)) })
      .catch((err: unknown) => logger.error({ err }, 'expired session sweep failed'));
  }, 3_600_000);
  sweep.unref();

  let closing: Promise<void> | undefined;
  const close = () =>
    (closing ??= (async () => {
      clearInterval(sweep);
      await new Promise<void>((r) => {
        server.close(() => r());
        server.closeIdleConnections();
      });
      await mailer.close();
      await services.rateLimits.close();
      if (dataSource.isInitialized) await dataSource.destroy();
    })());
  return { url, close };
}

async function main() {
  let config: Config;
  try {
    config = loadConfig();
  } catch (err) {
    if (err instanceof ConfigError) {
      process.stderr.write(`Hoverprint cannot start. ${err.message}\n`);
      process.exit(78); // EX_CONFIG
    }
    throw err;
  }
  const running = await startServer(config);
  const stop = (signal: string) => {
    process.stderr.write(`\n${signal} received, shutting down\n`);
    const force = setTimeout(() => process.exit(1), 10_000);
    force.unref();
    running.close().then(
      () => process.exit(0),
      () => process.exit(1),
    );
  };
  process.once('SIGTERM', () => stop('SIGTERM'));
  process.once('SIGINT', () => stop('SIGINT'));
}

if (process.argv[1] && /server[\\/]index\.ts$/.test(process.argv[1])) {
  main().catch((err: unknown) => {
    process.stderr.write(
      `Hoverprint failed to start: ${err instanceof Error ? (err.stack ?? err.message) : String(err)}\n`,
    );
    process.exit(1);
  });
}
