import Database from 'better-sqlite3';
import { closeSync, copyFileSync, existsSync, openSync, readSync, rmSync, statSync } from 'node:fs';

const HEADER_BYTES = 100;
const MAGIC = 'SQLite format 3\0';

/**
 * Replaces the database file with a backup after checking the backup is whole. The server must be
 * stopped: a running server keeps the old file open.
 */
export function restoreBackup(backupFile: string, dbFile: string): void {
  if (!existsSync(backupFile)) throw new Error(`No backup at ${backupFile}`);
  const problem = wholeDatabaseProblem(backupFile);
  if (problem) throw new Error(`The backup ${backupFile} ${problem}. Nothing was restored.`);
  for (const suffix of ['-wal', '-shm']) rmSync(`${dbFile}${suffix}`, { force: true });
  copyFileSync(backupFile, dbFile);
}

/** Why a file is not a whole SQLite database, or null when it is. */
function wholeDatabaseProblem(file: string): string | null {
  const size = statSync(file).size;
  const header = Buffer.alloc(HEADER_BYTES);
  const fd = openSync(file, 'r');
  try {
    readSync(fd, header, 0, HEADER_BYTES, 0);
  } finally {
    closeSync(fd);
  }
  if (size < HEADER_BYTES || header.toString('latin1', 0, MAGIC.length) !== MAGIC)
    return 'is not a SQLite database';
  // SQLite file format, "The database header": the page size at offset 16 (1 means 65536), the size
  // in pages at 28, trusted when the change counter at 24 matches the version-valid-for number at 92.
  const pageSize = header.readUInt16BE(16) === 1 ? 65_536 : header.readUInt16BE(16);
  const pages = header.readUInt32BE(28);
  if (header.readUInt32BE(24) === header.readUInt32BE(92) && size < pages * pageSize)
    return `is cut short: ${size} of ${pages * pageSize} bytes`;
  try {
    const check = new Database(file, { readonly: true, fileMustExist: true });
    try {
      const found = (check.pragma('integrity_check') as { integrity_check: string }[]).map(
        (row) => row.integrity_check,
      );
      return found[0] === 'ok' ? null : `failed SQLite's integrity check: ${found.join('; ')}`;
    } finally {
      check.close();
    }
  } catch (error) {
    return `is damaged: SQLite cannot read it (${(error as Error).message})`;
  }
}
