import 'reflect-metadata';
import { loadConfig } from './config.js';
import { monitorEventLoopDelay } from 'node:perf_hooks';
import { bootstrap } from './bootstrap.js';

const config = loadConfig();
const running = await bootstrap(config, { seed: 'full' });
const server = running.app.listen(config.port, config.host, () => {
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : config.port;
  console.log(`Tallyvolt is serving on http://${config.host === '0.0.0.0' ? 'localhost' : config.host}:${port}`);
  console.log(`database: ${config.databasePath}; mail: ${config.smtpUrl ? 'SMTP_URL' : 'local outbox (no delivery)'}`);
});

// The load script reads these lines to report how long requests could have waited behind other work.
if (process.env.TALLYVOLT_REPORT_EVENT_LOOP) {
  const loop = monitorEventLoopDelay({ resolution: 5 });
  loop.enable();
  setInterval(() => {
    console.log(`[loop] max ${(loop.max / 1e6).toFixed(1)} ms p99 ${(loop.percentile(99) / 1e6).toFixed(1)} ms`);
    loop.reset();
  }, 1000).unref();
}

async function shutdown(signal: string) {
  console.log(`${signal}: closing`);
  server.close();
  await running.close();
  process.exit(0);
}
process.on('SIGINT', () => void shutdown('SIGINT'));
process.on('SIGTERM', () => void shutdown('SIGTERM'));
