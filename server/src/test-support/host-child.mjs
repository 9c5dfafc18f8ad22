// The entry of a child started by `startServerProcess` (server-process.ts): loads the module named on the
// command line through Vite's module runner with the repository's vitest config, the transform the
// specs run under (decorator metadata for Nest, `shared` read from source). Plain Node cannot load
// the TypeScript, and tsx emits no decorator metadata.
import { fileURLToPath } from 'node:url';
import { createViteServer } from 'vitest/node';

const vite = await createViteServer({
  configFile: fileURLToPath(new URL('../../../vitest.config.ts', import.meta.url)),
  root: fileURLToPath(new URL('../../../', import.meta.url)),
  logLevel: 'error',
  appType: 'custom',
  server: { middlewareMode: true, hmr: false, ws: false, watch: null },
  optimizeDeps: { noDiscovery: true, include: [] },
});
const { hostChild } = await vite.environments.ssr.runner.import(
  fileURLToPath(new URL('./server-process.ts', import.meta.url)),
);
await hostChild(process.argv[2]);
