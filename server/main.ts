// Starts Eclipta: configuration, database and migrations, demo seed, mail, then the HTTP server.
import { mkdirSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import type { AppContext } from './app-context';
import { createApp } from './app';
import { ConfigError, loadConfig, resolveJwtSecret, type Config } from './config';
import { migrateDatabase, openDatabase } from './db/database';
import { createLogger } from './logger';
import { startMailer } from './mail/mailer';
import { seedDatabase } from './seed/seed';
import { clearLeftoverUploads } from './ephemerides/ephemeris-upload';
import { createHttpServer } from './request-timeouts';

let config: Config;
try {
  config = loadConfig();
} catch (err) {
  if (err instanceof ConfigError) {
    process.stderr.write(`Eclipta cannot start: ${err.message}\n`);
    process.exit(1);
  }
  throw err;
}

const logger = createLogger({ level: config.logLevel, file: config.logFile });
mkdirSync(config.dataDir, { recursive: true });
const leftovers = clearLeftoverUploads(config);
if (leftovers > 0) logger.warn('removed files of uploads interrupted by the last stop', { files: leftovers });
const { db, sqlite } = openDatabase(config.dbPath);
migrateDatabase(db, config.migrationsDir);
const mailer = await startMailer(config, logger);
const ctx: AppContext = { config, jwtSecret: resolveJwtSecret(config), db, sqlite, mailer, logger };
await seedDatabase(ctx);

const app = createApp(ctx);
const server = createHttpServer(app, config).listen(config.port, () => {
  const { port } = server.address() as AddressInfo;
  logger.info('Eclipta is listening', { url: `http://localhost:${port}`, publicUrl: config.publicUrl });
});
server.on('error', (err) => {
  logger.error('HTTP server failed', { error: err });
  process.exit(1);
});

let stopping = false;
function shutdown(signal: string): void {
  if (stopping) return;
  stopping = true;
  logger.info('shutting down', { signal });
  // Don't wait forever for keep-alive connections.
  const force = setTimeout(() => process.exit(0), 5000);
  force.unref();
  server.close(() => {
    void mailer.close().finally(() => {
      sqlite.close();
      process.exit(0);
    });
  });
  server.closeIdleConnections();
}
process.on('SIGTERM', () => shutdown('SIGTERM'));
process.on('SIGINT', () => shutdown('SIGINT'));
