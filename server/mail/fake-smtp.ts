import { randomUUID } from 'node:crypto';
import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';
import type { DevMail } from '../../shared/schemas/mail';
import { decodeWords, readMessage } from './mime';

/** Messages kept in memory; the oldest go first. */
const KEEP = 500;

export interface FakeSmtp {
  port: number;
  /** Newest first. */
  messages(): DevMail[];
  clear(): void;
  close(): Promise<void>;
}

/**
 * A local SMTP server that accepts every message and keeps it for the dev inbox. Bound to
 * loopback only. STARTTLS is off because smtp-server's bundled certificate has expired.
 */
export async function startFakeSmtp(port = 0): Promise<FakeSmtp> {
  const inbox: DevMail[] = [];
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    size: 10 * 1024 * 1024,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        const raw = Buffer.concat(chunks).toString('utf8');
        const msg = readMessage(raw);
        inbox.unshift({
          id: randomUUID(),
          from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
          to: session.envelope.rcptTo.map((r) => r.address),
          subject: decodeWords(msg.headers.get('subject') ?? ''),
          text: msg.text,
          html: msg.html,
          receivedAt: new Date().toISOString(),
        });
        inbox.length = Math.min(inbox.length, KEEP);
        callback();
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  const actual = (server.server.address() as AddressInfo).port;
  return {
    port: actual,
    messages: () => [...inbox],
    clear: () => void inbox.splice(0),
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
