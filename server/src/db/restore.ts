import { isAbsolute, join, resolve } from 'node:path';
import { restoreBackup } from '../backup/restore.js';
import { loadConfig } from '../config/app-config.js';

/** `npm run db:restore -- <backup file>` with the server stopped. */
const [given] = process.argv.slice(2);
const config = loadConfig();
if (!given) {
  console.error(`Usage: npm run db:restore -- <file>   (backups are in ${config.backupsDir})`);
  process.exit(2);
}
const file = isAbsolute(given) || given.includes('/') ? resolve(given) : join(config.backupsDir, given);
restoreBackup(file, config.dbFile);
console.log(`Restored ${file} into ${config.dbFile}. Start the server again.`);
