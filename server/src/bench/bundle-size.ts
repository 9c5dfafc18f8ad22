import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';

interface ManifestChunk {
  file: string;
  imports?: string[];
}

/**
 * Gzipped kB (1,000 bytes, as Vite prints them) of the JavaScript a screen of a built app needs before it can show: the entry
 * (`index.html` in Vite's manifest) and the route module, with every chunk they import statically,
 * followed through the manifest's `imports` (dynamic imports, loaded later, are left out). The apps
 * build with `manifest: true` for this.
 */
export function routeJsKb(appDist: string, routeModule: string): number {
  const manifest = JSON.parse(readFileSync(join(appDist, '.vite', 'manifest.json'), 'utf8')) as Record<
    string,
    ManifestChunk
  >;
  if (!manifest[routeModule]) throw new Error(`No ${routeModule} in the manifest of ${appDist}`);
  const files = new Set<string>();
  const visit = (key: string) => {
    const chunk = manifest[key]!;
    if (files.has(chunk.file)) return;
    files.add(chunk.file);
    for (const imported of chunk.imports ?? []) visit(imported);
  };
  visit('index.html');
  visit(routeModule);
  const bytes = [...files]
    .filter((file) => file.endsWith('.js'))
    .reduce((sum, file) => sum + gzipSync(readFileSync(join(appDist, file))).length, 0);
  return bytes / 1000;
}
