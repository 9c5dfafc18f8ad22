import { statSync } from 'node:fs';

/**
 * Whether the bundle holds the latest compile: made after every project's last compile (each writes its
 * `tsconfig.tsbuildinfo`). A missing file counts against it.
 */
export function isBundleFresh(bundle: URL, compiles: readonly URL[]): boolean {
  const modifiedMs = (file: URL) => statSync(file, { throwIfNoEntry: false })?.mtimeMs;
  const bundledMs = modifiedMs(bundle);
  return bundledMs !== undefined && compiles.every((file) => (modifiedMs(file) ?? Infinity) <= bundledMs);
}

/**
 * Whether `node server/dist/main.js` serves the bundle: the one beside it, if newer than the server's
 * and shared's last compile. `dist` is the URL of `server/dist/`.
 */
export function servesBundle(dist: URL): boolean {
  const compiles = ['../tsconfig.tsbuildinfo', '../../shared/tsconfig.tsbuildinfo'].map(
    (file) => new URL(file, dist),
  );
  return isBundleFresh(new URL('./bundle/serve.js', dist), compiles);
}
