import { existsSync, mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';
import type { Page, PageQuery } from '@baytime/shared';
import { decodeCursor, toPage } from '../common/paging.js';

/**
 * The index of what a local fake (mailbox, text box) received: a JSON array in one file that only
 * grows, rewritten whole through a rename so a crash never leaves half of it.
 */
export class JsonIndex<T extends { id: string; date: string }> {
  private entries: T[] | null = null;

  constructor(private readonly file: string) {}

  append(entry: T): void {
    mkdirSync(dirname(this.file), { recursive: true });
    const entries = [...this.all(), entry];
    const temporary = `${this.file}.${process.pid}.tmp`;
    writeFileSync(temporary, JSON.stringify(entries, null, 1));
    renameSync(temporary, this.file);
    this.entries = entries;
  }

  find(id: string): T | undefined {
    return this.all().find((entry) => entry.id === id);
  }

  /** One page, newest first. The index only grows, so an entry's place in it is its cursor. */
  page(query: PageQuery): Page<T> {
    const entries = this.all();
    const before = decodeCursor(query.cursor)?.id ?? entries.length;
    const start = Math.min(before, entries.length);
    const rows = entries
      .slice(Math.max(0, start - query.limit - 1), start)
      .map((entry, i, slice) => ({ entry, place: start - slice.length + i }))
      .reverse();
    return toPage(
      rows,
      query.limit,
      entries.length,
      ({ entry, place }) => ({ at: Date.parse(entry.date), id: place }),
      (shown) => shown.map(({ entry }) => entry),
    );
  }

  private all(): T[] {
    if (this.entries === null)
      this.entries = existsSync(this.file) ? (JSON.parse(readFileSync(this.file, 'utf8')) as T[]) : [];
    return this.entries;
  }
}
