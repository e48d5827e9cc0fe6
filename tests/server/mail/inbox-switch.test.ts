import { Writable } from 'node:stream';
import pino from 'pino';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseConfig } from '../../../server/config';
import { HealthResponse } from '../../../shared/schemas/health';
import { startMailer } from '../../../server/mail/mailer';
import { startTestApp, type TestApp } from '../helpers/test-app';

/** The fake inbox shows reset links; it must exist only when asked for and never via a proxy. */
describe('the dev inbox switch', () => {
  let off: TestApp;
  let on: TestApp;
  beforeAll(async () => {
    off = await startTestApp({
      env: { NODE_ENV: 'production', MAIL_FAKE: '', LOG_LEVEL: 'silent' },
    });
    on = await startTestApp({ env: { NODE_ENV: 'production', LOG_LEVEL: 'silent' }, smtp: true });
  });
  afterAll(async () => {
    await off.close();
    await on.close();
  });

  it('has no inbox route in production without MAIL_FAKE', async () => {
    expect(off.config.mail.mode).toBe('log');
    await request(off.app).get('/api/dev/mail').expect(404);
    await request(off.app).delete('/api/dev/mail').expect(404);
  });

  it('tells the client in the health answer whether the inbox is there, so it never asks in vain', async () => {
    const offHealth = HealthResponse.parse(
      (await request(off.app).get('/api/health').expect(200)).body,
    );
    expect(offHealth.devMail).toBe(false);
    const onHealth = HealthResponse.parse(
      (await request(on.app).get('/api/health').expect(200)).body,
    );
    expect(onHealth.devMail).toBe(true);
  });

  it('answers a direct request on this machine when MAIL_FAKE=1', async () => {
    const res = await request(on.app).get('/api/dev/mail').expect(200);
    expect(res.body).toEqual({ messages: [] });
  });

  it.each([
    ['x-forwarded-for', '203.0.113.7'],
    ['forwarded', 'for=203.0.113.7'],
    ['x-real-ip', '203.0.113.7'],
  ])('refuses a request carrying %s even with MAIL_FAKE=1', async (header, value) => {
    const res = await request(on.app).get('/api/dev/mail').set(header, value).expect(403);
    expect(res.body.error.code).toBe('forbidden');
    await request(on.app).delete('/api/dev/mail').set(header, value).expect(403);
  });
});

describe('mail with neither SMTP_URL nor MAIL_FAKE', () => {
  it('warns at start and writes each message to the log instead of sending it', async () => {
    const lines: { level: number; msg: string; to?: string; text?: string }[] = [];
    const sink = new Writable({
      write(chunk: Buffer, _enc, done) {
        for (const l of chunk.toString().split('\n').filter(Boolean)) lines.push(JSON.parse(l));
        done();
      },
    });
    const logger = pino({ level: 'info' }, sink);
    const mailer = await startMailer(parseConfig({ NODE_ENV: 'production' }).mail, logger);
    expect(mailer.inbox).toBeNull();
    expect(lines.some((l) => l.level === 40 && /no SMTP_URL and no MAIL_FAKE=1/.test(l.msg))).toBe(
      true,
    );
    await mailer.send({
      to: 'mara@crew.example',
      subject: 'Reset your Hoverprint password',
      text: 'Open http://hoverprint.test/reset/abc',
      html: '<p>Open</p>',
    });
    await mailer.close();
    const logged = lines.find((l) => l.msg === 'mail (not sent)');
    expect(logged).toMatchObject({ to: 'mara@crew.example' });
    expect(logged?.text).toContain('/reset/abc');
  });
});
