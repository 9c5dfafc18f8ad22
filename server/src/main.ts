import { fileURLToPath } from 'node:url';
import { createApp, listen } from './app.js';
import { loadConfig } from './config/app-config.js';

const repoRoot = fileURLToPath(new URL('../../', import.meta.url));
const config = loadConfig(process.env, repoRoot);
const app = await createApp(config);
await listen(app, config.port);
