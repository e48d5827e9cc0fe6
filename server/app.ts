import { existsSync } from 'node:fs';
import { join, resolve } from 'node:path';
import express, { type Express } from 'express';
import helmet from 'helmet';
import type { Logger } from 'pino';
import type { DataSource } from 'typeorm';
import type { Config } from './config';
import { authRouter } from './auth/auth.router';
import { commentsRouter } from './comments/comments.router';
import { aircraftRouter } from './aircraft/aircraft.router';
import { baselineRouter } from './baseline/baseline.router';
import { flightsRouter } from './flights/flights.router';
import { apiNotFound, errorHandler } from './http/error-handler';
import { healthRouter } from './http/health.router';
import { limitJsonDepth } from './http/json-depth';
import { clientCacheHeaders } from './http/client-cache';
import { createLogger, requestLogger } from './http/logger';
import { originCheck } from './http/origin-check';
import { sessionMiddleware } from './http/session';
import { presetsRouter } from './presets/presets.router';
import { devMailRouter } from './mail/dev-mail.router';
import { createMemoryMailer, type Mailer } from './mail/mailer';
import { createServices, type Services } from './services';
import { invitesRouter } from './teams/invites.router';
import { teamsRouter } from './teams/teams.router';

/** Where `npm run dev` serves the client (Vite's default port), proxying /api to us. */
const devServerOrigins = ['http://localhost:5173', 'http://127.0.0.1:5173'];

export interface AppDeps {
  dataSource: DataSource;
  config: Config;
  /** Outgoing mail; an in-memory one when not given. */
  mailer?: Mailer;
  /** Prebuilt services (to share them with demo loading); built from the rest when not given. */
  services?: Services;
  logger?: Logger;
  /** Built client served in production; `dist/` of the working directory by default. */
  clientDir?: string;
}

/** Builds the Express app without listening, so tests and the server share one wiring. */
export function createApp(deps: AppDeps): Express {
  const { dataSource, config } = deps;
  const logger = deps.logger ?? createLogger(config);
  const services =
    deps.services ?? createServices(dataSource, config, deps.mailer ?? createMemoryMailer());
  const app = express();
  app.disable('x-powered-by');
  if (config.trustProxy !== undefined) app.set('trust proxy', config.trustProxy);

  app.use(
    helmet({
      // Browsers remember HSTS for a year; promise HTTPS only where PUBLIC_URL serves it.
      strictTransportSecurity: config.publicUrl.startsWith('https:'),
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
  // A flight PUT carries its report and downsampled review detail (bounded at 6 MB).
  app.use('/api', express.json({ limit: '8mb', verify: limitJsonDepth }));
  app.use(
    '/api',
    originCheck(
      config.env === 'development' ? [config.publicUrl, ...devServerOrigins] : [config.publicUrl],
      config.trustProxy !== undefined,
    ),
  );
  app.use('/api', sessionMiddleware(services.auth.lucia));

  app.use(healthRouter(dataSource, config.mail.mode === 'fake'));
  app.use(authRouter(services, config));
  app.use(teamsRouter(services));
  app.use(invitesRouter(services));
  app.use(aircraftRouter(services));
  app.use(baselineRouter(services));
  app.use(presetsRouter(services));
  app.use(flightsRouter(services, config));
  app.use(commentsRouter(services));
  if (config.mail.mode === 'fake') app.use(devMailRouter(services.mailer, config));
  app.use('/api', apiNotFound);

  if (config.env === 'production') {
    const dist = deps.clientDir ?? resolve('dist');
    const index = join(dist, 'index.html');
    app.use(
      express.static(dist, { index: false, maxAge: '1h', setHeaders: clientCacheHeaders(dist) }),
    );
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
