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
