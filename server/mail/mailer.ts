import nodemailer, { type Transporter } from 'nodemailer';
import type { Logger } from 'pino';
import type { MailConfig } from '../config';
import type { DevMail } from '../../shared/schemas/mail';
import { startFakeSmtp, type FakeSmtp } from './fake-smtp';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
  headers?: Record<string, string>;
}

export interface Mailer {
  /** Sends now; rejects when the SMTP server refuses. */
  send(mail: OutgoingMail): Promise<void>;
  /**
   * Sends in the background (notifications must not slow or fail the request that caused
   * them); failures are logged.
   */
  queue(mail: OutgoingMail): void;
  /** Background work that ends in `queue` calls (looking up recipients); failures are logged. */
  track(work: Promise<unknown>): void;
  /** Resolves when every queued message has been handed to SMTP. */
  idle(): Promise<void>;
  /** What the fake SMTP caught, when it is on. */
  inbox: { messages(): DevMail[]; clear(): void } | null;
  close(): Promise<void>;
}

/**
 * nodemailer: over SMTP to the fake server (MAIL_FAKE=1) or to SMTP_URL; with neither, each
 * message is written to the server log so an operator can still pass on a reset link.
 */
export async function startMailer(config: MailConfig, logger: Logger): Promise<Mailer> {
  let fake: FakeSmtp | null = null;
  let transport: Transporter;
  if (config.mode === 'fake') {
    fake = await startFakeSmtp(config.fakePort);
    logger.info({ port: fake.port }, 'fake SMTP server catching all mail (see /api/dev/mail)');
    transport = nodemailer.createTransport({
      host: '127.0.0.1',
      port: fake.port,
      secure: false,
      ignoreTLS: true,
      pool: true,
      maxConnections: 2,
    });
  } else if (config.mode === 'smtp') {
    transport = nodemailer.createTransport(config.smtpUrl!);
  } else {
    logger.warn(
      'no SMTP_URL and no MAIL_FAKE=1: outgoing mail (invites, reset links) is only written to this log',
    );
    transport = nodemailer.createTransport({ jsonTransport: true });
  }

  const pending = new Set<Promise<void>>();
  const send = async (mail: OutgoingMail) => {
    await transport.sendMail({
      from: config.from,
      to: mail.to,
      subject: mail.subject,
      text: mail.text,
      html: mail.html,
      headers: mail.headers,
      // Base64 parts keep long lines and non-ASCII names intact through any relay.
      textEncoding: 'base64',
    });
    if (config.mode === 'log') {
      logger.warn({ to: mail.to, subject: mail.subject, text: mail.text }, 'mail (not sent)');
    }
  };
  return {
    send,
    queue(mail) {
      const p = send(mail)
        .catch((err: unknown) =>
          logger.error({ err, to: mail.to, subject: mail.subject }, 'mail not sent'),
        )
        .finally(() => pending.delete(p));
      pending.add(p);
    },
    track(work) {
      const p = work
        .then(() => undefined)
        .catch((err: unknown) => logger.error({ err }, 'mail preparation failed'))
        .finally(() => pending.delete(p));
      pending.add(p);
    },
    async idle() {
      while (pending.size > 0) await Promise.all([...pending]);
    },
    inbox: fake,
    async close() {
      await Promise.all([...pending]);
      transport.close();
      await fake?.close();
    },
  };
}

/**
 * A mailer that keeps messages in memory instead of speaking SMTP, for an app built without
 * one (unit tests of routes that never look at mail).
 */
export function createMemoryMailer(): Mailer {
  const kept: DevMail[] = [];
  const pending = new Set<Promise<void>>();
  const send = async (mail: OutgoingMail) => {
    kept.unshift({
      id: String(kept.length + 1),
      from: 'hoverprint',
      to: [mail.to],
      subject: mail.subject,
      text: mail.text,
      html: mail.html,
      receivedAt: new Date().toISOString(),
    });
  };
  const track = (p: Promise<unknown>) => {
    const q = p
      .then(
        () => undefined,
        () => undefined,
      )
      .finally(() => pending.delete(q));
    pending.add(q);
  };
  return {
    send,
    queue: (mail) => track(send(mail)),
    track,
    async idle() {
      while (pending.size > 0) await Promise.all([...pending]);
    },
    inbox: { messages: () => [...kept], clear: () => void kept.splice(0) },
    async close() {},
  };
}
