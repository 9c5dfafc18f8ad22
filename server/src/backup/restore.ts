import Database from 'better-sqlite3';
import { copyFileSync, existsSync, rmSync } from 'node:fs';

/**
 * Replaces the database file with a backup after checking the backup is whole. The server must be
 * stopped: a running server keeps the old file open.
 */
export function restoreBackup(backupFile: string, dbFile: string): void {
  if (!existsSync(backupFile)) throw new Error(`No backup at ${backupFile}`);
  const check = new Database(backupFile, { readonly: true, fileMustExist: true });
  try {
    const result = check.pragma('integrity_check', { simple: true });
    if (result !== 'ok') throw new Error(`The backup failed its integrity check: ${String(result)}`);
  } finally {
    check.close();
  }
  for (const suffix of ['-wal', '-shm']) rmSync(`${dbFile}${suffix}`, { force: true });
  copyFileSync(backupFile, dbFile);
}
