import { cpSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

export const migrations = fileURLToPath(new URL('../../drizzle', import.meta.url));

/** A copy of the migrations folder as it was up to and including `tag`, in `dir`. */
export function migrationsUpTo(tag: string, dir: string): string {
  const journal = JSON.parse(readFileSync(join(migrations, 'meta/_journal.json'), 'utf8')) as {
    entries: { tag: string }[];
  };
  const entries = journal.entries.slice(0, journal.entries.findIndex((entry) => entry.tag === tag) + 1);
  mkdirSync(join(dir, 'meta'), { recursive: true });
  writeFileSync(join(dir, 'meta/_journal.json'), JSON.stringify({ ...journal, entries }));
  for (const { tag: file } of entries) cpSync(join(migrations, `${file}.sql`), join(dir, `${file}.sql`));
  return dir;
}
