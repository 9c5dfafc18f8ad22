import { Inject, Injectable, Logger } from '@nestjs/common';
import { SQLITE, type Sqlite } from './database.js';

type Hook = () => void;

/**
 * One use case, one transaction. Everything a command writes (audit rows included) commits together
 * or not at all, and what must follow a commit (live messages, the in-memory floor) runs only after
 * it, in order, and never for a command that rolled back. Nested use cases join the outer one.
 */
@Injectable()
export class UnitOfWork {
  private readonly logger = new Logger(UnitOfWork.name);
  private pending: Hook[] | null = null;
  private committed = 0;

  constructor(@Inject(SQLITE) private readonly sqlite: Sqlite) {}

  get active(): boolean {
    return this.pending !== null;
  }

  /** Use cases committed since start-up. */
  get commits(): number {
    return this.committed;
  }

  run<T>(work: () => T): T {
    if (this.pending) return work();
    const hooks: Hook[] = [];
    this.pending = hooks;
    let result: T;
    try {
      // better-sqlite3 refuses a function that returns a promise: a use case's writes are synchronous.
      result = this.sqlite.connection.transaction(work)();
      this.committed++;
    } finally {
      this.pending = null;
    }
    for (const hook of hooks) this.runHook(hook);
    return result;
  }

  /** Runs `hook` once the current transaction commits; at once when none is open. */
  afterCommit(hook: Hook): void {
    if (this.pending) this.pending.push(hook);
    else this.runHook(hook);
  }

  private runHook(hook: Hook): void {
    try {
      hook();
    } catch (error) {
      this.logger.error('A step after a commit failed; the commit stands', error as Error);
    }
  }
}

/**
 * Runs the decorated method as one use case of the instance's `uow`: the method's body is the
 * transaction, whatever services it calls.
 */
export function Transactional() {
  return function <This extends { readonly uow: UnitOfWork }, Args extends unknown[], Result>(
    _target: This,
    _key: string | symbol,
    descriptor: TypedPropertyDescriptor<(this: This, ...args: Args) => Result>,
  ): void {
    const method = descriptor.value!;
    descriptor.value = function (this: This, ...args: Args): Result {
      return this.uow.run(() => method.apply(this, args));
    };
  };
}
