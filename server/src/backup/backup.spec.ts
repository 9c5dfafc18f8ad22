import { randomUUID } from 'node:crypto';
import { existsSync, mkdtempSync } from 'node:fs';
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

  it('refuses to restore a file that is not a whole database', () => {
    const dir = mkdtempSync(join(tmpdir(), 'baytime-restore-'));
    expect(() => restoreBackup(join(dir, 'missing.sqlite'), join(dir, 'db.sqlite'))).toThrow(/No backup/);
  });
});
