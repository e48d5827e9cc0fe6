import type { Express } from 'express';
import pino from 'pino';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { createApp } from '../../../server/app';
import { parseConfig, type Config } from '../../../server/config';
import { openDatabase } from '../../../server/db/data-source';
import { createMemoryMailer, startMailer, type Mailer } from '../../../server/mail/mailer';
import { createServices, type Services } from '../../../server/services';
import { freshStores } from './engine';
import { tempDir } from './temp-dir';

export interface TestApp {
  app: Express;
  config: Config;
  dataSource: DataSource;
  services: Services;
  mailer: Mailer;
  dir: string;
  close(): Promise<void>;
}

/**
 * The real app on a fresh SQLite file (schema from the migrations), or on a fresh PostgreSQL
 * database and bucket in the PostgreSQL leg (see engine.ts), with the fake SMTP server when
 * `smtp` is set, else an in-memory mailer.
 */
export async function startTestApp(
  options: { env?: Record<string, string>; smtp?: boolean } = {},
): Promise<TestApp> {
  const tmp = tempDir();
  const stores = await freshStores();
  const config = parseConfig({
    ...stores.env,
    NODE_ENV: 'test',
    DATA_DIR: tmp.dir,
    PORT: '0',
    PUBLIC_URL: 'http://hoverprint.test',
    AUTH_RATE_LIMIT: '1000',
    MAIL_FAKE: '1',
    ...options.env,
  });
  const { dataSource } = await openDatabase(config);
  const mailer = options.smtp
    ? await startMailer(config.mail, pino({ level: 'silent' }))
    : createMemoryMailer();
  const services = createServices(dataSource, config, mailer);
  const app = createApp({ dataSource, config, mailer, services });
  return {
    app,
    config,
    dataSource,
    services,
    mailer,
    dir: tmp.dir,
    async close() {
      await mailer.close();
      await services.rateLimits.close();
      if (dataSource.isInitialized) await dataSource.destroy();
      await stores.cleanup();
      tmp.cleanup();
    },
  };
}

let counter = 0;
export const uniqueEmail = (who: string) => `${who}.${process.pid}.${++counter}@crew.example`;
export const PASSWORD = 'correct horse battery';

/** Signs up a new user over HTTP; the returned agent carries the session cookie. */
export async function signedUpAgent(
  app: Express,
  name: string,
  email = uniqueEmail(name.toLowerCase()),
) {
  const agent = request.agent(app);
  const res = await agent
    .post('/api/auth/sign-up')
    .send({ email, password: PASSWORD, name })
    .expect(201);
  return { agent, id: (res.body as { user: { id: string } }).user.id, email, name };
}
