import fs from 'node:fs';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { loadConfig } from '../../server/config.js';
import { publicBaseUrl } from '../../server/common/public-url.js';
import { InviteToken } from '../../server/entities/InviteToken.js';

const linkIn = (text: string) => new URL(/https?:\/\/\S+\/invite\/[A-Za-z0-9_-]+/.exec(text)![0]);

/** The app on a loopback port of its own, so the address it listens on is known to the test. */
async function listening(t: TestApp): Promise<{ server: Server; origin: string }> {
  const server: Server = await new Promise((resolve) => { const s = t.app.listen(0, '127.0.0.1', () => resolve(s)); });
  return { server, origin: `http://127.0.0.1:${(server.address() as AddressInfo).port}` };
}

describe('links in e-mails never follow the request', () => {
  describe('without PUBLIC_URL', () => {
    let t: TestApp;
    let server: Server;
    let origin: string;
    beforeAll(async () => {
      t = await createTestApp({ publicUrl: null });
      ({ server, origin } = await listening(t));
    });
    afterAll(async () => {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await t.close();
    });

    it('builds an invitation link from the address the server listens on, not the Host header', async () => {
      const admin = request.agent(origin);
      expect((await admin.post('/api/auth/sign-in').send({ email: 'admin@example.test', password: 'tallyvolt-admin' })).status).toBe(200);
      const res = await admin.post('/api/invites').set('Host', 'evil.example').set('X-Forwarded-Host', 'evil.example')
        .send({ email: 'host.header@example.test', role: 'tester' });
      expect(res.status).toBe(201);
      const message = (await t.outbox()).find((m) => m.to.includes('host.header@example.test'))!;
      expect(message.text + (message.html ?? '')).not.toContain('evil.example');
      expect(linkIn(message.text).origin).toBe(origin);
    });
  });

  describe('with PUBLIC_URL', () => {
    let t: TestApp;
    beforeAll(async () => { t = await createTestApp({ publicUrl: 'https://tallyvolt.example.test' }); });
    afterAll(async () => { await t.close(); });

    it('uses PUBLIC_URL whatever Host the request names', async () => {
      const admin = await t.signIn('admin@example.test', 'tallyvolt-admin');
      const res = await admin.post('/api/invites').set('Host', 'evil.example').send({ email: 'configured@example.test', role: 'lead' });
      expect(res.status).toBe(201);
      const message = (await t.outbox()).find((m) => m.to.includes('configured@example.test'))!;
      expect(linkIn(message.text).origin).toBe('https://tallyvolt.example.test');
    });
  });

  describe('behind a proxy without PUBLIC_URL', () => {
    let t: TestApp;
    beforeAll(async () => { t = await createTestApp({ publicUrl: null, trustProxy: true }); });
    afterAll(async () => { await t.close(); });

    it('refuses a link-bearing e-mail, says to set PUBLIC_URL, and stores nothing', async () => {
      const admin = await t.signIn('admin@example.test', 'tallyvolt-admin');
      const before = await t.outbox();
      const res = await admin.post('/api/invites').set('X-Forwarded-Host', 'evil.example').set('X-Forwarded-Proto', 'https')
        .send({ email: 'proxied@example.test', role: 'tester' });
      expect(res.status).toBe(503);
      expect(res.body.error).toMatch(/PUBLIC_URL/);
      expect(await t.dataSource.getRepository(InviteToken).countBy({ email: 'proxied@example.test' })).toBe(0);
      expect(await t.outbox()).toHaveLength(before.length);
    });
  });

  it('takes the base from configuration and the connection alone (submit, decision and calibration notices share it)', () => {
    const config = { ...loadConfig({}), publicUrl: null, trustProxy: false };
    const forged = {
      get: (name: string) => ({ host: 'evil.example', 'x-forwarded-host': 'evil.example' } as Record<string, string>)[name.toLowerCase()],
      protocol: 'https', hostname: 'evil.example', headers: { host: 'evil.example' },
      socket: { localAddress: '::ffff:192.0.2.7', localPort: 3000 },
    };
    expect(publicBaseUrl(config, forged as never)).toBe('http://192.0.2.7:3000'); // RFC 5737 documentation address
    expect(publicBaseUrl(config, { ...forged, socket: { localAddress: '2001:db8::7', localPort: 3000 } } as never)).toBe('http://[2001:db8::7]:3000'); // RFC 3986 §3.2.2 brackets
    expect(publicBaseUrl({ ...config, publicUrl: 'https://tv.example.test' }, forged as never)).toBe('https://tv.example.test');
  });

  it('PUBLIC_URL must be an http(s) address; a trailing slash is dropped', () => {
    expect(loadConfig({ PUBLIC_URL: 'https://tv.example.test/' }).publicUrl).toBe('https://tv.example.test');
    expect(loadConfig({ PUBLIC_URL: 'https://tv.example.test/team/' }).publicUrl).toBe('https://tv.example.test/team');
    expect(() => loadConfig({ PUBLIC_URL: 'tv.example.test' })).toThrow(/PUBLIC_URL/);
    expect(() => loadConfig({ PUBLIC_URL: 'javascript:alert(1)' })).toThrow(/PUBLIC_URL/);
  });

  it('no server code but the same-origin check reads the Host header', () => {
    const root = path.resolve(import.meta.dirname, '..', '..', 'server');
    const readers: string[] = [];
    const walk = (dir: string) => {
      for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
        const full = path.join(dir, entry.name);
        if (entry.isDirectory()) walk(full);
        else if (/\.ts$/.test(entry.name) && /\.get\(\s*['"](x-forwarded-)?host['"]\s*\)|req\.(hostname|host)\b|headers\.host\b/i.test(fs.readFileSync(full, 'utf8'))) {
          readers.push(path.relative(root, full));
        }
      }
    };
    walk(root);
    expect(readers).toEqual(['common/csrf.ts']);
  });
});
