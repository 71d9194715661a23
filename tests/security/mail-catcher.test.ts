import net from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

/** A bare SMTP client: sends one command at a time and returns the server's (last) reply line. */
async function smtpSession(port: number) {
  const socket = net.connect(port, '127.0.0.1');
  let buffer = '';
  const waiting: ((line: string) => void)[] = [];
  socket.setEncoding('utf8');
  socket.on('data', (chunk: string) => {
    buffer += chunk;
    // A reply ends with a line whose code is followed by a space (RFC 5321 §4.2.1).
    let match: RegExpExecArray | null;
    while ((match = /^(\d{3}) .*\r\n/m.exec(buffer))) {
      buffer = buffer.slice(match.index + match[0].length);
      waiting.shift()?.(match[0].trim());
    }
  });
  const reply = () => new Promise<string>((resolve) => waiting.push(resolve));
  const greeting = await reply();
  return {
    greeting,
    send: (line: string) => { const r = reply(); socket.write(`${line}\r\n`); return r; },
    close: () => socket.destroy(),
  };
}

describe('the loopback mail catcher takes mail only from the app', () => {
  let t: TestApp;
  beforeAll(async () => { t = await createTestApp(); });
  afterAll(async () => { await t.close(); });

  it('refuses a local client without the secret, and nothing reaches the Outbox', async () => {
    const before = (await t.outbox()).length;
    const smtp = await smtpSession(t.mailFake!.port);
    try {
      expect(smtp.greeting).toMatch(/^220/);
      expect(await smtp.send('EHLO intruder.test')).toMatch(/^250/);
      expect(await smtp.send('MAIL FROM:<tallyvolt@example.test>')).toMatch(/^530/); // RFC 4954 §6: authentication required
      const plain = Buffer.from('\0tallyvolt\0guessed-secret').toString('base64');
      expect(await smtp.send(`AUTH PLAIN ${plain}`)).toMatch(/^535/); // RFC 4954 §6: credentials invalid
      expect(await smtp.send('MAIL FROM:<tallyvolt@example.test>')).toMatch(/^530/);
      expect(await smtp.send('RCPT TO:<admin@example.test>')).toMatch(/^5\d\d/);
      expect(await smtp.send('DATA')).toMatch(/^5\d\d/);
    } finally {
      smtp.close();
    }
    expect((await t.outbox()).length).toBe(before);
  });

  it('still stores the app\'s own mail', async () => {
    const admin = await t.signIn('admin@example.test', 'tallyvolt-admin');
    expect((await admin.post('/api/invites').send({ email: 'catcher@example.test', role: 'tester' })).status).toBe(201);
    expect((await t.outbox()).some((m) => m.to.includes('catcher@example.test'))).toBe(true);
  });
});
