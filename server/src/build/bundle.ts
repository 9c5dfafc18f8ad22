import { build } from 'esbuild';
import { readFileSync, rmSync } from 'node:fs';
import { builtinModules, createRequire } from 'node:module';
import { join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

/*
 * `npm run build`, after tsc: the compiled server and its packages in a few files under
 * `server/dist/bundle/`, which `node server/dist/main.js` then serves from (see main.ts). The code is
 * tsc's, decorator metadata included; the bundle only saves Node resolving, reading and linking some
 * 1,600 modules at every start. A package imported only when a feature needs it (mail, texts, photos,
 * the API docs) gets a file of its own, loaded on that first use.
 */

/** Left out of the bundle: loaded from node_modules at run time, as without a bundle. */
const EXTERNAL = [
  // Native addons.
  'better-sqlite3',
  'sharp',
  // Serves its browser client from files beside its code.
  'socket.io',
  // Also loaded by name at run time (Nest's static files): one copy serves both.
  'express',
  // Optional packages Nest imports only for features Baytime does not use; none is installed.
  '@nestjs/microservices',
  '@nestjs/microservices/*',
  '@fastify/static',
  'class-transformer',
  'class-validator',
];

/** Names a module of CommonJS uses for the files beside it, which a bundle no longer has. */
const OWN_FILES = /\b__(dirname|filename)\b/;

const dist = fileURLToPath(new URL('../', import.meta.url));
const outdir = join(dist, 'bundle');
rmSync(outdir, { recursive: true, force: true });
const { metafile } = await build({
  entryPoints: [join(dist, 'serve.js')],
  outdir,
  bundle: true,
  splitting: true,
  format: 'esm',
  platform: 'node',
  target: 'node20',
  // Nest names providers, modules and loggers after their classes.
  keepNames: true,
  external: EXTERNAL,
  // Bundled CommonJS calls `require` for Node's own modules and for the packages left out.
  banner: {
    js: "import { createRequire as bundleRequire } from 'node:module'; const require = bundleRequire(import.meta.url);",
  },
  metafile: true,
  logLevel: 'warning',
});

// A bundled module that reads files beside its code would fail on that path only, at run time: stop here.
const readingOwnFiles = Object.keys(metafile.inputs).filter((input) =>
  OWN_FILES.test(readFileSync(input, 'utf8')),
);
if (readingOwnFiles.length > 0) {
  rmSync(outdir, { recursive: true, force: true });
  throw new Error(
    `These modules read files beside their code; leave their packages out (EXTERNAL in server/src/build/bundle.ts):\n${readingOwnFiles.join('\n')}`,
  );
}

// A package left out is found from the bundle's folder now, not from the module that imports it: a
// version of it nested under that module's package would be missed.
const resolvedFrom = (file: string, request: string) => {
  try {
    return createRequire(file).resolve(request);
  } catch {
    return null;
  }
};
const elsewhere = Object.entries(metafile.inputs).flatMap(([input, { imports }]) =>
  imports
    .filter(({ external, path }) => external && !builtinModules.includes(path.replace(/^node:/, '')))
    .filter(({ path }) => resolvedFrom(resolve(input), path) !== resolvedFrom(join(outdir, 'serve.js'), path))
    .map(({ path }) => `${path} from ${input}`),
);
if (elsewhere.length > 0) {
  rmSync(outdir, { recursive: true, force: true });
  throw new Error(`From the bundle these would load another copy:\n${[...new Set(elsewhere)].join('\n')}`);
}
