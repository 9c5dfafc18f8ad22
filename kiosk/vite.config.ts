import { defineConfig, defaultClientConditions } from 'vite';
import react from '@vitejs/plugin-react';
import { fileURLToPath } from 'node:url';

const server = process.env.BAYTIME_SERVER ?? 'http://localhost:3000';

export default defineConfig({
  base: '/kiosk/',
  plugins: [react()],
  resolve: {
    conditions: ['@baytime/source', ...defaultClientConditions],
    alias: { '@': fileURLToPath(new URL('./src', import.meta.url)) },
  },
  server: {
    port: 5174,
    proxy: {
      '/api': server,
      '/socket.io': { target: server, ws: true },
    },
  },
  preview: { port: 4174 },
  build: {
    target: ['chrome100', 'safari15', 'firefox100', 'edge100'],
    chunkSizeWarningLimit: 600,
    // dist/.vite/manifest.json: which chunks each route loads, read by `npm run bench` for its sizes.
    manifest: true,
    rolldownOptions: {
      // The shared package holds declarations and pure functions only: a module of it that the
      // kiosk does not use needs not ship (its zod schemas are built at load time otherwise).
      treeshake: {
        moduleSideEffects: (id: string) => (/[\\/]shared[\\/]src[\\/]/.test(id) ? false : undefined),
      },
    },
  },
});
