import { createApp, listen } from './app.js';
import { loadConfig, REPO_ROOT } from './config/app-config.js';

const config = loadConfig(process.env, REPO_ROOT);
const app = await createApp(config);
await listen(app, config.port);
