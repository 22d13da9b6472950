import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

const apiPort = Number(process.env.SHEDWRIGHT_PORT ?? 4780);

export default defineConfig({
  plugins: [react(), tailwindcss()],
  // `@/…` is `src/…` (tsconfig.json says the same for the type checker and the linter).
  resolve: { alias: { '@': fileURLToPath(new URL('./src', import.meta.url)) } },
  server: {
    host: '127.0.0.1',
    proxy: { '/api': `http://127.0.0.1:${apiPort}` },
    watch: { ignored: ['**/.data/**', '**/tests/e2e/artifacts/**'] },
  },
  build: {
    outDir: 'dist',
    rolldownOptions: {
      // The service worker must be served from the root to control every page.
      input: { main: 'index.html', 'service-worker': 'src/service-worker.ts' },
      output: {
        entryFileNames: (chunk) => (chunk.name === 'service-worker' ? 'service-worker.js' : 'assets/[name]-[hash].js'),
        codeSplitting: {
          groups: [
            { name: 'canvas', test: /node_modules[\\/](konva|react-konva)/ },
            { name: 'react', test: /node_modules[\\/](react|react-dom|react-router|react-router-dom|@tanstack|scheduler)[\\/]/ },
          ],
        },
      },
    },
  },
  test: {
    // Each suite is a project so `scripts/test.mjs` can run them all and sum the counts.
    projects: [
      { test: { name: 'shared', include: ['tests/shared/**/*.test.ts'], environment: 'node' } },
      {
        test: {
          name: 'server',
          include: ['tests/server/**/*.test.ts'],
          environment: 'node',
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        extends: true,
        test: {
          name: 'web',
          include: ['tests/web/**/*.test.{ts,tsx}'],
          environment: 'happy-dom',
          setupFiles: ['tests/helpers/web-setup.ts'],
          // The canvas painters read their colours from the theme file, so the tests must see its text.
          css: { include: [/src\/theme\.css/] },
        },
      },
      {
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          fileParallelism: false,
          testTimeout: 60_000,
          hookTimeout: 120_000,
        },
      },
    ],
  },
});
