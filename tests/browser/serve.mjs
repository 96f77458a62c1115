// Starts the bundled server for the browser tests with a fresh database, data dir and fake SMTP.
import { mkdirSync, rmSync } from 'node:fs';
import { resolve } from 'node:path';

const dataDir = resolve(`tmp/browser-data-${process.env.PORT}`);
rmSync(dataDir, { recursive: true, force: true });
mkdirSync(dataDir, { recursive: true });
Object.assign(process.env, {
  ECLIPTA_DATA_DIR: dataDir,
  ECLIPTA_DB_PATH: resolve(dataDir, 'eclipta.db'),
  ECLIPTA_LOG_FILE: resolve(dataDir, 'server.log'),
  ECLIPTA_PUBLIC_URL: `http://127.0.0.1:${process.env.PORT}`,
  ECLIPTA_SEED: 'demo',
  // The password reset test follows the link it reads in the Mail outbox, as a developer would.
  ECLIPTA_OUTBOX_LINKS: 'shown',
});
delete process.env.SMTP_URL;
await import('../../dist/server/main.mjs');
