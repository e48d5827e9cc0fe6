import { existsSync } from 'node:fs';
import { join, resolve } from 'node:path';
import express, { type Express } from 'express';
import helmet from 'helmet';
import type { Logger } from 'pino';
import type { DataSource } from 'typeorm';
import type { Config } from './config';
import { apiNotFound, errorHandler } from './http/error-handler';
import { healthRouter } from './http/health.router';
import { createLogger, requestLogger } from './http/logger';

export interface AppDeps {
  dataSource: DataSource;
  config: Config;
  logger?: Logger;
}

/** Builds the Express app without listening, so tests and the server share one wiring. */
export function createApp(deps: AppDeps): Express {
  const { dataSource, config } = deps;
  const logger = deps.logger ?? createLogger(config);
  const app = express();
  app.disable('x-powered-by');
  if (config.trustProxy !== undefined) app.set('trust proxy', config.trustProxy);

  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          // Analysis workers are module workers; blob: covers bundler-made worker URLs.
          'worker-src': ["'self'", 'blob:'],
          // Field use is often plain HTTP on a LAN address; upgrading would break it.
          'upgrade-insecure-requests': null,
        },
      },
    }),
  );
  app.use(requestLogger(logger));
  app.use(express.json({ limit: '8mb' }));

  app.use(healthRouter(dataSource));
  app.use('/api', apiNotFound);

  if (config.env === 'production') {
    const dist = resolve('dist');
    const index = join(dist, 'index.html');
    app.use(express.static(dist, { index: false, maxAge: '1h' }));
    // Client routes (/fleet, /flights/…) all load the SPA shell.
    app.get('/{*splat}', (_req, res, next) => {
      if (!existsSync(index)) {
        next();
        return;
      }
      res.set('cache-control', 'no-cache').sendFile(index);
    });
  }

  app.use(errorHandler);
  return app;
}
