import { defineConfig, defaultClientConditions } from 'vite';
import react from '@vitejs/plugin-react';
import { fileURLToPath } from 'node:url';

const server = process.env.BAYTIME_SERVER ?? 'http://localhost:3000';

export default defineConfig({
  plugins: [react()],
  resolve: {
    alias: { '@': fileURLToPath(new URL('./src', import.meta.url)) },
    conditions: ['@baytime/source', ...defaultClientConditions],
  },
  server: {
    port: 5173,
    proxy: {
      '/api': server,
      '/socket.io': { target: server, ws: true },
    },
  },
  preview: { port: 4173 },
  build: {
    // Wall screens run whatever browser the TV ships: keep the syntax old enough for them.
    target: ['chrome87', 'safari14', 'firefox78', 'edge88'],
    chunkSizeWarningLimit: 400,
    // dist/.vite/manifest.json: which chunks each route loads, read by `npm run bench` for its sizes.
    manifest: true,
  },
});
