import 'reflect-metadata';
import { loadConfig } from './config.js';
import { bootstrap } from './bootstrap.js';

const config = loadConfig();
const running = await bootstrap(config, { seed: 'full' });
const server = running.app.listen(config.port, config.host, () => {
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : config.port;
  console.log(`Tallyvolt is serving on http://${config.host === '0.0.0.0' ? 'localhost' : config.host}:${port}`);
  console.log(`database: ${config.databasePath}; mail: ${config.smtpUrl ? 'SMTP_URL' : 'local outbox (no delivery)'}`);
});

async function shutdown(signal: string) {
  console.log(`${signal}: closing`);
  server.close();
  await running.close();
  process.exit(0);
}
process.on('SIGINT', () => void shutdown('SIGINT'));
process.on('SIGTERM', () => void shutdown('SIGTERM'));
