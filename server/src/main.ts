import { setFlagsFromString } from 'node:v8';
import { servesBundle } from './build/fresh-bundle.js';

/*
 * Let the old generation grow by 30 % of what survived the last full collection before the next one, not
 * V8's default (about double for a heap this size). A punch leaves garbage that outlives two scavenges, and
 * with the default the server's RSS climbed from about 180 to 220-240 MB under the bench's load before V8
 * collected it; with 30 % it stays near 180 MB, for no CPU a punch that the bench can tell.
 */
setFlagsFromString('--heap-growing-percent=30');

/*
 * `npm run build` bundles the server into `bundle/` beside this file (see build/bundle.ts): Node loads
 * a few large files in about half the time it takes to find, read and link the 1,600 modules of the
 * server and its packages one by one. A compile after it (`tsc -b -w`, a typecheck) leaves the bundle
 * behind: then, as in development, the compiled modules serve.
 */
await import(servesBundle(new URL('./', import.meta.url)) ? './bundle/serve.js' : './serve.js');
