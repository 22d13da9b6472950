import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { VitePWA } from 'vite-plugin-pwa';

const apiPort = Number(process.env.SHEDWRIGHT_PORT ?? 4780);

export default defineConfig({
  plugins: [
    react(),
    tailwindcss(),
    // The service worker (Workbox, generated at build time) keeps the built app on the device, so the
    // At the loom page reloads at a loom with no connection; the page keeps its own copy of the draft,
    // plan and place. API answers are never cached by it: the pages know how old their copies are.
    VitePWA({
      strategies: 'generateSW',
      filename: 'service-worker.js',
      // src/main.tsx registers it, in the built app only.
      injectRegister: false,
      manifest: false,
      registerType: 'autoUpdate',
      workbox: {
        globPatterns: ['**/*.{js,css,html,woff,woff2,svg,png,ico}'],
        // Every page of the app is index.html; /api and the server's own pages are not.
        navigateFallback: '/index.html',
        navigateFallbackDenylist: [/^\/api\//, /^\/admin\//, /^\/healthz$/, /^\/readyz$/],
        maximumFileSizeToCacheInBytes: 5 * 1024 * 1024,
        cleanupOutdatedCaches: true,
        clientsClaim: true,
        skipWaiting: true,
      },
    }),
  ],
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
      output: {
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
