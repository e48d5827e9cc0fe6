import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';

const apiPort = Number(process.env.API_PORT ?? 8080);

export default defineConfig({
  plugins: [react()],
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
