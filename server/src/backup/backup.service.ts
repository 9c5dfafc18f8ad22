import { Inject, Injectable, Logger, type OnModuleInit } from '@nestjs/common';
import { SchedulerRegistry } from '@nestjs/schedule';
import { readdirSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { APP_CONFIG, type AppConfig } from '../config/app-config.js';
import { SQLITE, type Sqlite } from '../db/database.js';

const BACKUP_NAME = /^baytime-\d{8}T\d{6}Z\.sqlite$/;

export interface BackupSchedule {
  everyMs: number;
  keep: number;
}

/** Reads BAYTIME_BACKUP_HOURS (default 6; 0 turns the schedule off) and BAYTIME_BACKUP_KEEP (default 28). */
export function backupSchedule(env: NodeJS.ProcessEnv = process.env): BackupSchedule {
  const hours = Number(env.BAYTIME_BACKUP_HOURS ?? 6);
  const keep = Number(env.BAYTIME_BACKUP_KEEP ?? 28);
  return {
    everyMs: Number.isFinite(hours) && hours > 0 ? hours * 3600_000 : 0,
    keep: Number.isInteger(keep) && keep > 0 ? keep : 28,
  };
}

/**
 * Online backups with SQLite's backup API while the shop keeps punching: a consistent copy in the
 * data dir's backups folder on a schedule, keeping the newest `keep` files.
 */
@Injectable()
export class BackupService implements OnModuleInit {
  private readonly logger = new Logger(BackupService.name);
  private readonly schedule = backupSchedule();

  constructor(
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    @Inject(SQLITE) private readonly sqlite: Sqlite,
    private readonly scheduler: SchedulerRegistry,
  ) {}

  /** The interval is read from the environment, so it is added to Nest's scheduler here, which stops it on shutdown. */
  onModuleInit(): void {
    if (!this.schedule.everyMs) return;
    const backups = setInterval(
      () =>
        void this.backupNow().catch((error: Error) => this.logger.error(`Backup failed: ${error.message}`)),
      this.schedule.everyMs,
    );
    backups.unref();
    this.scheduler.addInterval('backups', backups);
  }

  async backupNow(now = new Date()): Promise<string> {
    const stamp = now
      .toISOString()
      .replace(/[-:]/g, '')
      .replace(/\.\d+Z$/, 'Z');
    const file = join(this.config.backupsDir, `baytime-${stamp}.sqlite`);
    await this.sqlite.connection.backup(file);
    this.rotate();
    this.logger.log(`Backed up to ${file}`);
    return file;
  }

  list(): string[] {
    return readdirSync(this.config.backupsDir)
      .filter((name) => BACKUP_NAME.test(name))
      .sort();
  }

  private rotate(): void {
    const all = this.list();
    for (const name of all.slice(0, Math.max(0, all.length - this.schedule.keep)))
      rmSync(join(this.config.backupsDir, name));
  }
}
