import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

// One file configures the client build, the dev server and the test runner.
// The dev server proxies the API and the collaboration socket to the Express
// server that `npm run dev` starts beside it.
const apiPort = Number(process.env.API_PORT ?? 4821);

export default defineConfig({
  plugins: [react(), tailwindcss()],
  build: { outDir: 'dist', sourcemap: true },
  server: {
    port: Number(process.env.PORT ?? 4820),
    proxy: {
      '/api': `http://127.0.0.1:${apiPort}`,
      '/dev': `http://127.0.0.1:${apiPort}`,
      '/collab': { target: `ws://127.0.0.1:${apiPort}`, ws: true },
    },
  },
  test: {
    projects: [
      {
        extends: true,
        test: { name: 'unit', include: ['tests/unit/**/*.test.ts'], environment: 'node' },
      },
      {
        extends: true,
        test: {
          name: 'api',
          include: ['tests/api/**/*.test.ts', 'tests/collab/**/*.test.ts', 'tests/cluster/**/*.test.ts', 'tests/fuzz/**/*.test.ts'],
          environment: 'node',
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        extends: true,
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          testTimeout: 60_000,
          hookTimeout: 120_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
