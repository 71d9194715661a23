import fs from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { gunzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

/** The bytes as they cross the wire (supertest would unzip them). */
function raw(server: http.Server, urlPath: string, acceptEncoding: string): Promise<{ encoding?: string; body: Buffer }> {
  const { port } = server.address() as AddressInfo;
  return new Promise((resolve, reject) => {
    http.get({ host: '127.0.0.1', port, path: urlPath, headers: { 'accept-encoding': acceptEncoding } }, (res) => {
      const parts: Buffer[] = [];
      res.on('data', (c: Buffer) => parts.push(c));
      res.on('end', () => resolve({ encoding: res.headers['content-encoding'], body: Buffer.concat(parts) }));
    }).on('error', reject);
  });
}

const SCRIPT = `export const rows = ${JSON.stringify(Array.from({ length: 400 }, (_, i) => ({ row: i, label: 'divider ratio' })))};\n`;

describe('static client files', () => {
  let t: TestApp;
  let root: string;
  beforeAll(async () => {
    root = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyvolt-static-'));
    fs.mkdirSync(path.join(root, 'assets'));
    fs.writeFileSync(path.join(root, 'index.html'), '<!doctype html><html><head><title>shell</title></head><body></body></html>');
    fs.writeFileSync(path.join(root, 'assets', 'index-a1b2c3.js'), SCRIPT);
    t = await createTestApp({ distDir: root });
  });
  afterAll(async () => {
    await t.close();
    fs.rmSync(root, { recursive: true, force: true });
  });

  it('sends a script gzipped to a browser that accepts it, and whole to one that does not', async () => {
    const server = t.app.listen(0, '127.0.0.1');
    await new Promise((r) => server.once('listening', r));
    try {
      const zipped = await raw(server, '/assets/index-a1b2c3.js', 'gzip');
      expect(zipped.encoding).toBe('gzip');
      expect(zipped.body.length).toBeLessThan(SCRIPT.length / 4); // RFC 1952 gzip of a repetitive text (in this test)
      expect(gunzipSync(zipped.body).toString()).toBe(SCRIPT);
      const plain = await raw(server, '/assets/index-a1b2c3.js', 'identity');
      expect(plain.encoding).toBeUndefined();
      expect(plain.body.toString()).toBe(SCRIPT);
    } finally {
      await new Promise((r) => server.close(r));
    }
  });

  it('keeps hashed assets a year and never serves a stale app shell', async () => {
    const asset = await t.agent().get('/assets/index-a1b2c3.js');
    expect(asset.headers['cache-control']).toBe('public, max-age=31536000, immutable'); // RFC 8246 immutable, one year in seconds
    const shell = await t.agent().get('/designs');
    expect(shell.status).toBe(200);
    expect(shell.headers['cache-control']).not.toMatch(/immutable/);
  });

  it('leaves API answers as they were', async () => {
    const res = await t.agent().get('/api/no-such-thing').set('Accept-Encoding', 'gzip');
    expect(res.status).toBe(404);
    expect(res.headers['content-encoding']).toBeUndefined();
  });
});
