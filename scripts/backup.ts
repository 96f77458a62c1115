// `npm run backup`: an online backup of the configured database into <data dir>/backups/.
// `npm run restore -- <file>`: put a backup back (stop the server first).
import path from 'node:path';
import { loadConfig } from '../server/config';
import { backupDatabase, restoreDatabase } from '../server/db/backup';

const config = loadConfig();
const [command, file] = process.argv.slice(2);

if (command === 'restore') {
  if (!file) {
    console.error('Say which backup to restore: npm run restore -- data/backups/eclipta-….db');
    process.exit(2);
  }
  const kept = restoreDatabase(path.resolve(file), config.dbPath);
  console.log(`Restored ${file} to ${config.dbPath}; the replaced database is kept as ${kept}.`);
} else {
  const target = await backupDatabase(config.dbPath, path.join(config.dataDir, 'backups'));
  console.log(`Backed up ${config.dbPath} to ${target}.`);
}
