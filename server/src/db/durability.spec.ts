import { randomUUID } from 'node:crypto';
import type { IncomingMessage, Server, ServerResponse } from 'node:http';
import Database from 'better-sqlite3';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, type TestApp } from '../test-support/test-app.js';
import { SQLITE, type Sqlite } from './database.js';
import { UnitOfWork } from './unit-of-work.js';
import { WalSync } from './wal-sync.js';

/** What the database looked like at the moment the server began to write a response. */
interface AtAnswer {
  status: number;
  inTransaction: boolean;
  storedForOthers: boolean;
  /** Every commit so far has been fsynced. */
  onDisk: boolean;
}

/**
 * A kill -9 leaves what the server wrote in the operating system's page cache, so a crash test cannot
 * tell a synced write from one that was only handed to the kernel. This checks the facts the claim
 * rests on instead: the database runs in WAL mode, and the server answers a punch only once its
 * transaction has committed and the WAL has been fsynced after that commit.
 */
describe('durable answers', () => {
  let sut: TestApp;
  let sqlite: Sqlite;
  beforeAll(async () => {
    sut = await startTestApp();
    sqlite = sut.app.get<Sqlite>(SQLITE);
  });
  afterAll(() => sut.close());

  it("runs the server's connection in WAL mode, syncing the WAL itself", () => {
    // SQLite documentation, PRAGMA synchronous: NORMAL is 1; in WAL mode NORMAL syncs the WAL only at
    // checkpoints, and a commit is durable once the WAL file is synced.
    expect(sqlite.connection.pragma('journal_mode', { simple: true })).toBe('wal');
    expect(sqlite.connection.pragma('synchronous', { simple: true })).toBe(1);
  });

  it('answers a punch only after its transaction committed and the WAL was synced', async () => {
    const tech = await sut.badge('1045');
    // Another connection sees only committed data: the row is visible to it once the commit is done.
    const other = new Database(sut.config.dbFile, { readonly: true, fileMustExist: true });
    const storedForOthers = other.prepare('select count(*) as n from punches where id = ?');
    const uow = sut.app.get(UnitOfWork);
    const walSync = sut.app.get(WalSync);
    const server = sut.app.getHttpServer() as Server;
    const id = randomUUID();
    const seen: AtAnswer[] = [];
    const watch = (request: IncomingMessage, response: ServerResponse) => {
      if (request.method !== 'POST' || request.url !== '/api/punches') return;
      const look = () =>
        seen.push({
          status: response.statusCode,
          inTransaction: sqlite.connection.inTransaction,
          storedForOthers: (storedForOthers.get(id) as { n: number }).n === 1,
          onDisk: walSync.syncedCommits >= uow.commits,
        });
      const { writeHead, end } = response;
      response.writeHead = ((...args: Parameters<typeof writeHead>) => {
        look();
        return writeHead.apply(response, args);
      }) as typeof writeHead;
      response.end = ((...args: Parameters<typeof end>) => {
        look();
        return end.apply(response, args);
      }) as typeof end;
    };
    // First in line, so the watch is on before the app handles the request.
    server.prependListener('request', watch);
    try {
      const response = await sut.http().post('/api/punches').auth(tech.accessToken, { type: 'bearer' }).send({
        id,
        kind: 'break-start',
        breakKind: 'rest',
      });
      expect(response.status).toBe(201);
    } finally {
      server.off('request', watch);
      other.close();
    }
    expect(seen.length).toBeGreaterThan(0);
    for (const moment of seen)
      expect(moment).toEqual({ status: 201, inTransaction: false, storedForOthers: true, onDisk: true });
  });
});
