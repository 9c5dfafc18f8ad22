import { servesBundle } from './build/fresh-bundle.js';

/*
 * `npm run build` bundles the server into `bundle/` beside this file (see build/bundle.ts): Node loads
 * a few large files in about half the time it takes to find, read and link the 1,600 modules of the
 * server and its packages one by one. A compile after it (`tsc -b -w`, a typecheck) leaves the bundle
 * behind: then, as in development, the compiled modules serve.
 */
await import(servesBundle(new URL('./', import.meta.url)) ? './bundle/serve.js' : './serve.js');
