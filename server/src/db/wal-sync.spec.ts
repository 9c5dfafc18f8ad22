import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, beforeEach, describe, expect, it, vi } from 'vitest';
import { openDatabase, type Sqlite } from './database.js';
import { UnitOfWork } from './unit-of-work.js';
import { WalSync } from './wal-sync.js';

const synced = vi.hoisted(() => ({ files: [] as string[], opened: new Map<number, string>(), opens: 0 }));

// The real fsync, counted: which file each one was for.
vi.mock('node:fs', async (original) => {
  const fs = await original<typeof import('node:fs')>();
  return {
    ...fs,
    openSync: (file: string, flags: string) => {
      const descriptor = fs.openSync(file, flags);
      synced.opened.set(descriptor, file);
      synced.opens++;
      return descriptor;
    },
    fdatasync: (descriptor: number, callback: (error: NodeJS.ErrnoException | null) => void) => {
      synced.files.push(synced.opened.get(descriptor) ?? `descriptor ${descriptor}`);
      fs.fdatasync(descriptor, callback);
    },
  };
});

describe(WalSync.name, () => {
  let dir: string;
  let sqlite: Sqlite;
  let uow: UnitOfWork;
  let sut: WalSync;
  const commit = () => uow.run(() => sqlite.connection.prepare("insert into probe values ('x')").run());

  beforeAll(() => {
    dir = mkdtempSync(join(tmpdir(), 'baytime-wal-'));
    sqlite = openDatabase(join(dir, 'shop.db'));
    sqlite.connection.exec('create table probe (v text)');
    uow = new UnitOfWork(sqlite);
    sut = new WalSync(sqlite, uow);
  });
  afterAll(() => {
    sut.onModuleDestroy();
    sqlite.connection.close();
    rmSync(dir, { recursive: true, force: true });
  });
  beforeEach(() => void (synced.files.length = 0));

  it('fsyncs the WAL file of the connection once a commit waits for it', async () => {
    commit();
    await sut.flush();
    expect(synced.files).toEqual([join(dir, 'shop.db-wal')]);
    expect(sut.syncedCommits).toBe(uow.commits);
  });

  it('needs no fsync when nothing was committed since the last', async () => {
    commit();
    await sut.flush();
    synced.files.length = 0;
    await sut.flush();
    expect(synced.files).toEqual([]);
  });

  it('shares one fsync among the commits before it, and syncs again for a commit made while it ran', async () => {
    commit();
    commit();
    const first = sut.flush();
    const alongside = sut.flush();
    commit();
    const later = sut.flush();
    const withLater = sut.flush();
    await Promise.all([first, alongside, later, withLater]);
    expect(synced.files).toHaveLength(2);
    expect(sut.syncedCommits).toBe(uow.commits);
  });

  it('opens the WAL once for all its fsyncs', async () => {
    const opensBefore = synced.opens;
    for (let i = 0; i < 3; i++) {
      commit();
      await sut.flush();
    }
    expect(synced.opens - opensBefore).toBe(0);
  });
});
