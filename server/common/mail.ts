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
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
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
      : nodemailer.createTransport({ host: '127.0.0.1', port: target.fakePort, secure: false, ignoreTLS: true });
  return {
    async send(message) {
      await transport.sendMail({ from, ...message });
    },
    async close() {
      transport.close();
    },
  };
}
