// Starts Eclipta: configuration, database and migrations, demo seed, mail, then the HTTP server.
import type { AddressInfo } from 'node:net';
import type { AppContext } from './app-context';
import { createApp } from './app';
import { ConfigError, loadConfig, resolveJwtSecret, type Config } from './config';
import { migrateDatabase, openDatabase } from './db/database';
import { createLogger } from './logger';
import { startMailer } from './mail/mailer';
import { seedDatabase } from './seed/seed';
import { createBackgroundWork } from './background-work';
import { privateDir } from './private-files';
import { clearLeftoverUploads } from './ephemerides/ephemeris-upload';
import { createHttpServer } from './request-timeouts';

// Every file the server makes (database, its -wal and -shm, mail, uploads, logs) is born private.
process.umask(0o077);

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
privateDir(config.dataDir);
const leftovers = clearLeftoverUploads(config);
if (leftovers > 0) logger.warn('removed files of uploads interrupted by the last stop', { files: leftovers });
const { db, sqlite } = openDatabase(config.dbPath);
migrateDatabase(db, config.migrationsDir);
const mailer = await startMailer(config, logger);
const background = createBackgroundWork(logger);
const ctx: AppContext = { config, jwtSecret: resolveJwtSecret(config), db, sqlite, mailer, logger, background };
await seedDatabase(ctx);

const app = createApp(ctx);
const server = createHttpServer(app, config).listen(config.port, config.host, () => {
  const { port } = server.address() as AddressInfo;
  // Loopback and "every interface" are both reached at localhost; any other address by itself.
  const local = ['127.0.0.1', '::1', '0.0.0.0', '::', 'localhost'].includes(config.host);
  const shownHost = local ? 'localhost' : config.host.includes(':') ? `[${config.host}]` : config.host;
  logger.info('Eclipta is listening', { url: `http://${shownHost}:${port}`, host: config.host, publicUrl: config.publicUrl });
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
    void background
      .idle()
      .then(() => mailer.close())
      .finally(() => {
        sqlite.close();
        process.exit(0);
      });
  });
  server.closeIdleConnections();
}
process.on('SIGTERM', () => shutdown('SIGTERM'));
process.on('SIGINT', () => shutdown('SIGINT'));
