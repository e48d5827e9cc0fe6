import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';
import { VitePWA } from 'vite-plugin-pwa';

const apiPort = Number(process.env.API_PORT ?? 8080);

export default defineConfig({
  plugins: [
    react(),
    // The app shell (HTML, JS incl. workers, CSS, fonts) is precached so import and review open
    // at the field with no network; API answers are never cached by the service worker.
    VitePWA({
      strategies: 'generateSW',
      registerType: 'autoUpdate',
      injectRegister: false,
      includeAssets: ['favicon.svg'],
      manifest: {
        name: 'Hoverprint',
        short_name: 'Hoverprint',
        description:
          'Reads a multirotor flight log and says which motor works too hard, where the CG sits, and whether the battery and ESCs had headroom.',
        theme_color: '#1f3a4d',
        background_color: '#f7f5f0',
        display: 'standalone',
        start_url: '/',
        icons: [{ src: '/favicon.svg', sizes: 'any', type: 'image/svg+xml', purpose: 'any' }],
      },
      workbox: {
        globPatterns: ['**/*.{js,css,html,svg,woff2}'],
        navigateFallback: '/index.html',
        navigateFallbackDenylist: [/^\/api\//],
        // Worker bundles carry the analysis engine; allow them in the precache.
        maximumFileSizeToCacheInBytes: 8 * 1024 * 1024,
        cleanupOutdatedCaches: true,
        clientsClaim: true,
        skipWaiting: true,
      },
      devOptions: { enabled: false },
    }),
  ],
  worker: { format: 'es' },
  server: {
    proxy: { '/api': `http://127.0.0.1:${apiPort}` },
  },
  build: { outDir: 'dist', sourcemap: true, chunkSizeWarningLimit: 1500 },
  test: {
    include: ['tests/**/*.test.{ts,tsx}'],
    environment: 'node',
    pool: 'forks',
    testTimeout: 30_000,
  },
});
