import { defineConfig, defaultClientConditions } from 'vite';
import react from '@vitejs/plugin-react';
import { VitePWA } from 'vite-plugin-pwa';
import { fileURLToPath } from 'node:url';

const server = process.env.BAYTIME_SERVER ?? 'http://localhost:3000';

export default defineConfig({
  base: '/kiosk/',
  plugins: [
    react(),
    // An installable app: a service worker serves the shell and every asset from the tablet, so a
    // reload without Wi-Fi still shows the keypad. A new build waits until the technician says so.
    VitePWA({
      registerType: 'prompt',
      injectRegister: false,
      scope: '/kiosk/',
      manifest: {
        name: 'Baytime kiosk',
        short_name: 'Baytime',
        description: 'Shift, break and job clock for the shop floor',
        start_url: '/kiosk/',
        scope: '/kiosk/',
        display: 'standalone',
        background_color: '#10161c',
        theme_color: '#10161c',
        icons: [
          { src: 'icon-192.png', sizes: '192x192', type: 'image/png' },
          { src: 'icon-512.png', sizes: '512x512', type: 'image/png', purpose: 'any maskable' },
        ],
      },
      workbox: {
        globPatterns: ['**/*.{js,css,html,woff,woff2,png,svg}'],
        navigateFallback: '/kiosk/index.html',
        navigateFallbackAllowlist: [/^\/kiosk\//],
        // Fluent and the fonts make the main chunk large; the whole app must be on the tablet.
        maximumFileSizeToCacheInBytes: 4 * 1024 * 1024,
        cleanupOutdatedCaches: true,
        // The first worker takes the open page at once, so it works offline without a reload first.
        clientsClaim: true,
      },
    }),
  ],
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
