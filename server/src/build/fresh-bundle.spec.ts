import { mkdtempSync, rmSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { isBundleFresh } from './fresh-bundle.js';

describe(isBundleFresh.name, () => {
  const dir = mkdtempSync(join(tmpdir(), 'baytime-bundle-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));
  /** A file last written `secondsAgo` seconds ago. */
  const file = (name: string, secondsAgo: number) => {
    const path = join(dir, name);
    writeFileSync(path, '');
    const at = Date.now() / 1000 - secondsAgo;
    utimesSync(path, at, at);
    return pathToFileURL(path);
  };

  it('serves the bundle made after the last compile of each project', () => {
    expect(
      isBundleFresh(file('bundle.js', 10), [file('server.tsbuildinfo', 20), file('shared.tsbuildinfo', 30)]),
    ).toBe(true);
  });

  it('leaves it behind once a project compiled again, or when a file is missing', () => {
    const compiles = [file('server.tsbuildinfo', 20), file('shared.tsbuildinfo', 5)];
    expect(isBundleFresh(file('bundle.js', 10), compiles)).toBe(false);
    expect(isBundleFresh(pathToFileURL(join(dir, 'none.js')), compiles)).toBe(false);
    expect(
      isBundleFresh(file('bundle.js', 1), [...compiles, pathToFileURL(join(dir, 'none.tsbuildinfo'))]),
    ).toBe(false);
  });
});
