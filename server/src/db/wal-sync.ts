import {
  Inject,
  Injectable,
  type CallHandler,
  type ExecutionContext,
  type NestInterceptor,
  type OnModuleDestroy,
} from '@nestjs/common';
import { close, fdatasync, openSync } from 'node:fs';
import { from, mergeMap, type Observable } from 'rxjs';
import type { Request } from 'express';
import { SQLITE, type Sqlite } from './database.js';
import { UnitOfWork } from './unit-of-work.js';

/**
 * Puts committed transactions on disk without holding the event loop. The connection runs WAL with
 * synchronous=NORMAL, so a commit only hands its pages to the kernel (a kill -9 cannot lose them);
 * before an answer says "saved", `flush` fsyncs the WAL file on libuv's thread pool, which a power cut
 * cannot undo either. One fsync covers every commit before it: under load, answers share them.
 *
 * The WAL file is opened once and kept: SQLite deletes it only when its last connection closes, and
 * this connection lives as long as the server (a checkpoint rewinds the file, it never replaces it).
 */
@Injectable()
export class WalSync implements OnModuleDestroy {
  private readonly walFile: string;
  private descriptor: number | null = null;
  private running: Promise<void> | null = null;
  /** The commits the running fsync covers. */
  private runningUpTo = 0;
  private next: Promise<void> | null = null;
  /** Commits of the unit of work known to be on disk. */
  private synced = 0;

  constructor(
    @Inject(SQLITE) sqlite: Sqlite,
    private readonly uow: UnitOfWork,
  ) {
    this.walFile = `${sqlite.connection.name}-wal`;
  }

  /** How many of the unit of work's commits are known to be on disk. */
  get syncedCommits(): number {
    return this.synced;
  }

  /** Resolves once every transaction committed before the call is on disk. */
  flush(): Promise<void> {
    if (this.synced >= this.uow.commits) return Promise.resolve();
    if (!this.running) return this.start();
    if (this.runningUpTo >= this.uow.commits) return this.running;
    // The running fsync began before this commit: one more follows it, for all who wait.
    this.next ??= this.running.then(
      () => this.start(),
      () => this.start(),
    );
    return this.next;
  }

  private start(): Promise<void> {
    this.next = null;
    const upTo = this.uow.commits;
    this.runningUpTo = upTo;
    this.running = this.syncWal().then(
      () => {
        this.synced = Math.max(this.synced, upTo);
        this.running = null;
      },
      (error: unknown) => {
        this.running = null;
        throw error;
      },
    );
    return this.running;
  }

  onModuleDestroy(): void {
    if (this.descriptor !== null) close(this.descriptor, () => undefined);
    this.descriptor = null;
  }

  private syncWal(): Promise<void> {
    // Opened at the first commit that waits: SQLite creates the WAL with the connection's first write.
    this.descriptor ??= openSync(this.walFile, 'r');
    const descriptor = this.descriptor;
    return new Promise((resolve, reject) =>
      fdatasync(descriptor, (error) => (error ? reject(error) : resolve())),
    );
  }
}

const READS = new Set(['GET', 'HEAD', 'OPTIONS']);

/** Global: a request that may have written is answered only once what it committed is on disk. */
@Injectable()
export class DurableAnswerInterceptor implements NestInterceptor {
  constructor(private readonly walSync: WalSync) {}

  intercept(context: ExecutionContext, next: CallHandler): Observable<unknown> {
    if (context.getType() !== 'http' || READS.has(context.switchToHttp().getRequest<Request>().method))
      return next.handle();
    return next.handle().pipe(mergeMap((answer) => from(this.walSync.flush().then(() => answer))));
  }
}
