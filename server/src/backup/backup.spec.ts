import { randomUUID } from 'node:crypto';
import Database from 'better-sqlite3';
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import type { Timecard } from '@baytime/shared';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';
import { BackupService, backupSchedule } from './backup.service.js';
import { restoreBackup } from './restore.js';

describe(BackupService.name, () => {
  const apps: TestApp[] = [];
  afterAll(async () => {
    for (const app of apps) await app.close().catch(() => undefined);
  });

  it('takes an online backup that restores into a working shop, punches included', async () => {
    const sut = await startTestApp();
    apps.push(sut);
    const tech = await sut.badge('1045');
    const id = randomUUID();
    await sut
      .http()
      .post('/api/punches')
      .auth(tech.accessToken, { type: 'bearer' })
      .send({ id, kind: 'break-start', breakKind: 'rest' })
      .expect(201);
    const file = await sut.app.get(BackupService).backupNow();
    expect(existsSync(file)).toBe(true);

    const restoredDir = mkdtempSync(join(tmpdir(), 'baytime-restore-'));
    restoreBackup(file, join(restoredDir, 'baytime.sqlite'));
    const restored = await startTestApp({ BAYTIME_DATA_DIR: restoredDir, BAYTIME_DEMO: '0' });
    apps.push(restored);
    const owner = await restored.signIn(DEMO.owner);
    const card = await restored
      .http()
      .get(`/api/timecards?technicianId=${tech.user.id}`)
      .auth(owner, { type: 'bearer' })
      .expect(200);
    expect((card.body as Timecard).punches.filter((p) => p.id === id)).toHaveLength(1);
  });

  it('keeps only the newest backups', async () => {
    const sut = await startTestApp();
    apps.push(sut);
    const service = sut.app.get(BackupService);
    const keep = backupSchedule().keep;
    for (let i = 0; i < keep + 3; i++) await service.backupNow(new Date(Date.UTC(2026, 0, 1, 0, 0, i)));
    const kept = service.list();
    expect(kept).toHaveLength(keep);
    expect(kept[0]).toBe('baytime-20260101T000003Z.sqlite');
  });

  it('refuses to restore a file that is not a whole database, and leaves the database as it was', async () => {
    const sut = await startTestApp();
    apps.push(sut);
    const backup = await sut.app.get(BackupService).backupNow();
    const whole = readFileSync(backup);
    const dir = mkdtempSync(join(tmpdir(), 'baytime-restore-'));
    const dbFile = join(dir, 'db.sqlite');
    writeFileSync(dbFile, 'the database in use');
    const refusal = (file: string) => {
      try {
        restoreBackup(file, dbFile);
      } catch (error) {
        return (error as Error).message;
      }
      return 'restored';
    };

    expect(refusal(join(dir, 'missing.sqlite'))).toBe(`No backup at ${join(dir, 'missing.sqlite')}`);

    const text = join(dir, 'notes.sqlite');
    writeFileSync(text, 'Bay 3: lift inspection due in March\n'.repeat(200));
    expect(refusal(text)).toBe(`The backup ${text} is not a SQLite database. Nothing was restored.`);

    // A copy that stopped halfway: the header still promises every page.
    const truncated = join(dir, 'truncated.sqlite');
    writeFileSync(truncated, whole.subarray(0, 40_000));
    expect(refusal(truncated)).toBe(
      `The backup ${truncated} is cut short: 40000 of ${whole.length} bytes. Nothing was restored.`,
    );

    // One page overwritten inside the file: the punches table's first page.
    const reader = new Database(backup, { readonly: true });
    const { rootpage } = reader
      .prepare("select rootpage from sqlite_schema where name = 'punches'")
      .get() as {
      rootpage: number;
    };
    const pageSize = reader.pragma('page_size', { simple: true }) as number;
    reader.close();
    const damaged = join(dir, 'damaged.sqlite');
    const bytes = Buffer.from(whole);
    bytes.fill(0xff, (rootpage - 1) * pageSize, rootpage * pageSize);
    writeFileSync(damaged, bytes);
    expect(refusal(damaged)).toBe(
      `The backup ${damaged} is damaged: SQLite cannot read it (database disk image is malformed). Nothing was restored.`,
    );

    expect(readFileSync(dbFile, 'utf8')).toBe('the database in use');
    expect(refusal(backup)).toBe('restored');
    expect(readFileSync(dbFile).equals(whole)).toBe(true);
  });
});
