import { rmSync } from 'node:fs';
import { loadConfig } from '../config/app-config.js';
import { createApp } from '../app.js';

/** `npm run db:reset`: deletes the database and builds a fresh demo shop in its place. */
const config = loadConfig({ ...process.env, BAYTIME_DEMO: '1' });
for (const suffix of ['', '-wal', '-shm']) rmSync(`${config.dbFile}${suffix}`, { force: true });
const app = await createApp(config, ['error', 'warn']);
await app.close();
console.log(`Fresh demo database at ${config.dbFile}`);
