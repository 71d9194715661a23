import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

const INDEX = '<!doctype html><html><head><title>Tallyvolt shell</title><script type="module" src="/assets/app.js"></script></head><body><div id="app"></div></body></html>';

/** A client folder whose absolute path passes through a dot-folder, as a checkout under ~/.local/share would. */
function dotFolderClient(): { root: string; distDir: string } {
  const root = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyvolt-serve-'));
  const distDir = path.join(root, '.local', 'share', 'tallyvolt', 'dist');
  fs.mkdirSync(path.join(distDir, 'assets'), { recursive: true });
  fs.writeFileSync(path.join(distDir, 'index.html'), INDEX);
  fs.writeFileSync(path.join(distDir, 'assets', 'app.js'), 'export const shell = 1;\n');
  return { root, distDir };
}

describe('serving the built client', () => {
  let t: TestApp;
  let root: string;
  beforeAll(async () => {
    const client = dotFolderClient();
    root = client.root;
    t = await createTestApp({ distDir: client.distDir });
  });
  afterAll(async () => {
    await t.close();
    fs.rmSync(root, { recursive: true, force: true });
  });

  it('serves the app shell and its files from a folder under a dot-folder', async () => {
    for (const page of ['/', '/designs', '/stock', '/revisions/3/review']) {
      const res = await t.agent().get(page);
      expect(res.status, page).toBe(200);
      expect(res.text, page).toContain('<title>Tallyvolt shell</title>');
    }
    const script = await t.agent().get('/assets/app.js');
    expect(script.status).toBe(200);
    expect(script.text).toContain('export const shell');
  });

  it('still serves no dotfile inside the client folder', async () => {
    fs.writeFileSync(path.join(t.config.distDir, '.secret'), 'not for the web');
    const res = await t.agent().get('/.secret');
    expect(res.text).not.toContain('not for the web');
  });

  it('does not ask the browser to upgrade requests when the page came over plain HTTP', async () => {
    const res = await t.agent().get('/');
    const csp = res.headers['content-security-policy'];
    expect(csp).toContain("default-src 'self'");
    expect(csp).not.toContain('upgrade-insecure-requests');
  });
});

describe('the Content-Security-Policy behind an HTTPS proxy', () => {
  let t: TestApp;
  beforeAll(async () => { t = await createTestApp({ trustProxy: true }); });
  afterAll(async () => { await t.close(); });

  it('asks the browser to upgrade requests only when the request came over HTTPS', async () => {
    const secure = await t.agent().get('/api/auth/me').set('X-Forwarded-Proto', 'https');
    expect(secure.headers['content-security-policy']).toContain('upgrade-insecure-requests');
    const plain = await t.agent().get('/api/auth/me').set('X-Forwarded-Proto', 'http');
    expect(plain.headers['content-security-policy']).not.toContain('upgrade-insecure-requests');
    expect(plain.headers['content-security-policy']).toContain("default-src 'self'");
  });
});
