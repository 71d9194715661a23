// The JavaScript a browser must fetch before the first screen: the entry script and its preloaded
// chunks, gzipped. Routes are lazy, so each page's own code comes later. Target ≤ 250 kB.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import { build } from 'vite';

export async function benchInitialBundle(): Promise<void> {
  const outDir = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyvolt-bundle-'));
  try {
    await build({ configFile: path.resolve(import.meta.dirname, '..', '..', 'vite.config.ts'), logLevel: 'silent', build: { outDir, emptyOutDir: true } });
    const html = fs.readFileSync(path.join(outDir, 'index.html'), 'utf8');
    const initial = [...html.matchAll(/<(?:script[^>]*type="module"[^>]*src|link[^>]*rel="modulepreload"[^>]*href)="\/([^"]+\.js)"/g)].map((m) => m[1]);
    const all = fs.readdirSync(path.join(outDir, 'assets')).filter((f) => f.endsWith('.js'));
    const gz = (f: string) => gzipSync(fs.readFileSync(path.join(outDir, f))).length;
    const initialBytes = initial.reduce((n, f) => n + gz(f), 0);
    const allBytes = all.reduce((n, f) => n + gz(path.join('assets', f)), 0);
    console.log(`initial JavaScript (gzipped): ${(initialBytes / 1024).toFixed(1)} kB in ${initial.length} files (target ≤ 250 kB); all ${all.length} chunks: ${(allBytes / 1024).toFixed(1)} kB`);
  } finally {
    fs.rmSync(outDir, { recursive: true, force: true });
  }
}
