import { availableParallelism } from 'node:os';
import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

export default defineConfig({
  resolve: { conditions: ['@baytime/source'] },
  ssr: { resolve: { conditions: ['@baytime/source'] } },
  test: {
    // Vitest's default is a core less than the machine has: one worker, every file in turn, on 2 cores.
    // Two let the server's specs run beside the browser tests, which mostly wait (13 min down to 10.5).
    maxWorkers: Math.max(2, availableParallelism() - 1),
    projects: [
      { extends: true, test: { name: 'shared', include: ['shared/src/**/*.spec.ts'] } },
      {
        extends: true,
        resolve: { alias: { '@': fileURLToPath(new URL('./kiosk/src', import.meta.url)) } },
        test: { name: 'kiosk', include: ['kiosk/src/**/*.spec.ts'] },
      },
      {
        extends: true,
        resolve: { alias: { '@': fileURLToPath(new URL('./board/src', import.meta.url)) } },
        test: { name: 'board', include: ['board/src/**/*.spec.ts'] },
      },
      {
        extends: true,
        // Starting the app in a hook takes more than vitest's 10 s default on a busy 2-core machine.
        test: {
          name: 'server',
          include: ['server/src/**/*.spec.ts'],
          pool: 'forks',
          testTimeout: 20_000,
          hookTimeout: 30_000,
        },
      },
      {
        extends: true,
        test: {
          name: 'e2e',
          include: ['e2e/**/*.e2e.ts'],
          pool: 'forks',
          fileParallelism: false,
          testTimeout: 60_000,
          hookTimeout: 60_000,
        },
      },
    ],
  },
});
