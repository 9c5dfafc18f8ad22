import type Database from 'better-sqlite3';
import type { Db } from './database.js';

/** A transaction is open on the connection behind `db`: what it reads may yet be rolled back. */
export function inTransaction(db: Db): boolean {
  return (db as Db & { $client: Database.Database }).$client.inTransaction;
}
