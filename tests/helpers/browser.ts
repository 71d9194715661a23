import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { ARTIFACTS_DIR, ensureBuiltClient } from './built-client.js';
import { createTestApp, type TestApp } from './test-app.js';


/** Launch flags that work on this machine's closed network (see the team's stack notes). */
const CHROMIUM_ARGS = [
  '--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
  '--disable-background-networking', '--disable-component-update', '--disable-sync',
];

export interface BrowserRig {
  app: TestApp;
  baseUrl: string;
  context: BrowserContext;
  page: Page;
  screenshot(name: string): Promise<string>;
  close(): Promise<void>;
}

/** The built client served by a real app on a free loopback port, and a fresh chromium profile. */
export async function openBrowserRig(): Promise<BrowserRig> {
  const app = await createTestApp({ distDir: await ensureBuiltClient(), publicUrl: null }, 'full');
  const server: Server = await new Promise((resolve) => {
    const s = app.app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const profile = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyvolt-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: '/usr/bin/chromium',
    headless: true,
    args: CHROMIUM_ARGS,
    viewport: { width: 1280, height: 860 },
  });
  const page = context.pages()[0] ?? (await context.newPage());
  fs.mkdirSync(ARTIFACTS_DIR, { recursive: true });
  return {
    app, baseUrl, context, page,
    async screenshot(name) {
      const file = path.join(ARTIFACTS_DIR, `${name}.png`);
      await page.screenshot({ path: file, fullPage: true });
      return file;
    },
    async close() {
      await context.close();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await app.close();
      fs.rmSync(profile, { recursive: true, force: true });
    },
  };
}
