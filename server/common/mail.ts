import crypto from 'node:crypto';
import nodemailer, { type Transporter } from 'nodemailer';
import { SMTPServer } from 'smtp-server';
import { simpleParser, type AddressObject } from 'mailparser';
import type { DataSource } from 'typeorm';
import { OutboxMessage } from '../entities/OutboxMessage.js';

export interface MailMessage {
  to: string;
  subject: string;
  text: string;
  html?: string;
}

export interface Mailer {
  send(message: MailMessage): Promise<void>;
  close(): Promise<void>;
}

export interface MailFake {
  port: number;
  close(): Promise<void>;
}

const MAX_MESSAGE_BYTES = 2 * 1024 * 1024;

/** The loopback fake's login: a fresh random secret per process, known only to this process's mailer. */
const FAKE_SMTP_USER = 'tallyvolt';
const FAKE_SMTP_SECRET = crypto.randomBytes(32).toString('base64url');

function sameSecret(given: string, expected: string): boolean {
  const a = crypto.createHash('sha256').update(given).digest();
  const b = crypto.createHash('sha256').update(expected).digest();
  return crypto.timingSafeEqual(a, b);
}

function addressText(value: AddressObject | AddressObject[] | undefined): string {
  if (!value) return '';
  return (Array.isArray(value) ? value : [value]).map((a) => a.text).join(', ');
}

/**
 * A real SMTP server on loopback that stores every message it receives in the outbox table, so the
 * demo and the tests send mail through the same path a deployment uses, just without delivery.
 */
export async function startMailFake(dataSource: DataSource): Promise<MailFake> {
  const outbox = dataSource.getRepository(OutboxMessage);
  const server = new SMTPServer({
    // Any local process can reach a loopback port: only a client that knows this process's secret may send,
    // so nothing but the app itself can put a message in the Outbox.
    authOptional: false,
    authMethods: ['PLAIN', 'LOGIN'],
    // Plain-text AUTH is acceptable only because the listener is bound to loopback below.
    allowInsecureAuth: true,
    disabledCommands: ['STARTTLS'],
    onAuth(auth, _session, callback) {
      if (auth.username === FAKE_SMTP_USER && sameSecret(auth.password ?? '', FAKE_SMTP_SECRET)) return callback(null, { user: FAKE_SMTP_USER });
      callback(Object.assign(new Error('authentication failed'), { responseCode: 535 }));
    },
    size: MAX_MESSAGE_BYTES,
    logger: false,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then((parsed) =>
          outbox.save(
            outbox.create({
              to: addressText(parsed.to).slice(0, 1000),
              from: addressText(parsed.from).slice(0, 254),
              subject: (parsed.subject ?? '').slice(0, 500),
              text: parsed.text ?? '',
              html: typeof parsed.html === 'string' ? parsed.html : null,
            }),
          ),
        )
        .then(() => callback(), (err: Error) => callback(err));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => resolve());
  });
  const address = server.server.address();
  const port = typeof address === 'object' && address ? address.port : 0;
  return { port, close: () => new Promise<void>((resolve) => server.close(() => resolve())) };
}

/** Nodemailer over SMTP: SMTP_URL when set, otherwise the loopback fake on `fakePort`. */
export function createMailer(from: string, target: { smtpUrl: string } | { fakePort: number }): Mailer {
  const transport: Transporter =
    'smtpUrl' in target
      ? nodemailer.createTransport(target.smtpUrl)
      : nodemailer.createTransport({
        host: '127.0.0.1', port: target.fakePort, secure: false, ignoreTLS: true,
        auth: { user: FAKE_SMTP_USER, pass: FAKE_SMTP_SECRET },
      });
  return {
    async send(message) {
      await transport.sendMail({ from, ...message });
    },
    async close() {
      transport.close();
    },
  };
}
