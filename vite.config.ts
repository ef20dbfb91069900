import { fileURLToPath, URL } from 'node:url';
import { defineConfig } from 'vitest/config';
import vue from '@vitejs/plugin-vue';
import Components from 'unplugin-vue-components/vite';
import { ElementPlusResolver } from 'unplugin-vue-components/resolvers';
import { VitePWA } from 'vite-plugin-pwa';

const apiPort = process.env.PORT ?? '3000';

export default defineConfig({
  root: fileURLToPath(new URL('./client', import.meta.url)),
  // Element Plus on demand: each view's chunk imports only the components (and their CSS) it uses.
  plugins: [
    vue(),
    Components({ resolvers: [ElementPlusResolver({ importStyle: 'css' })], dts: false }),
    // The installable app: a web app manifest and a Workbox service worker that precaches the built shell (HTML,
    // scripts, styles, fonts, the engine worker, icons), so a reload with no connection opens the app. The API is
    // never cached by the service worker (answers are per user): the client keeps its own per-user copies
    // (client/src/api/offlineReads.ts). 'prompt': a new version waits until the bowler chooses to load it.
    VitePWA({
      registerType: 'prompt',
      injectRegister: false,
      manifestFilename: 'manifest.webmanifest',
      includeAssets: ['apple-touch-icon.png'],
      manifest: {
        id: '/',
        name: 'Lanewright',
        short_name: 'Lanewright',
        description: 'Lane-condition and ball-matchup advice for ten-pin bowlers, coaches and centers.',
        lang: 'en',
        start_url: '/',
        scope: '/',
        display: 'standalone',
        background_color: '#ffffff',
        theme_color: '#083f40',
        icons: [
          { src: '/icon-192.png', sizes: '192x192', type: 'image/png' },
          { src: '/icon-512.png', sizes: '512x512', type: 'image/png' },
          { src: '/icon-maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
        ],
      },
      workbox: {
        globPatterns: ['**/*.{js,css,html,woff,woff2,png,svg,webmanifest}'],
        // The whole app, lazy views included, so every screen opens offline (the largest chunk is about 1.5 MB).
        maximumFileSizeToCacheInBytes: 6 * 1024 * 1024,
        navigateFallback: '/index.html',
        navigateFallbackDenylist: [/^\/api\//],
        cleanupOutdatedCaches: true,
        // No runtimeCaching: nothing under /api/ ever enters the service worker's caches.
      },
    }),
  ],
  resolve: {
    alias: {
      '@': fileURLToPath(new URL('./client/src', import.meta.url)),
      '@engine': fileURLToPath(new URL('./engine', import.meta.url)),
      '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
    },
  },
  build: {
    outDir: fileURLToPath(new URL('./dist/client', import.meta.url)),
    emptyOutDir: true,
    chunkSizeWarningLimit: 1500,
  },
  server: {
    host: '127.0.0.1',
    proxy: { '/api': `http://127.0.0.1:${apiPort}` },
  },
  test: {
    root: fileURLToPath(new URL('.', import.meta.url)),
    projects: [
      {
        extends: true,
        test: { name: 'engine', include: ['tests/engine/**/*.test.ts'], environment: 'node' },
      },
      {
        extends: true,
        test: {
          // The client's composables, stores and unit formatting, in a browser-like page (happy-dom) whose API
          // address answers nothing: what needs a real server is proven by the e2e project.
          name: 'client',
          include: ['tests/client/**/*.test.ts'],
          environment: 'happy-dom',
          environmentOptions: { happyDOM: { url: 'http://127.0.0.1:9/' } },
        },
      },
      {
        extends: true,
        test: {
          name: 'api',
          include: ['tests/api/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/helpers/apiSetup.ts'],
          setupFiles: ['tests/helpers/apiEnv.ts'],
          fileParallelism: false,
          testTimeout: 20000,
          hookTimeout: 60000,
        },
      },
      {
        extends: true,
        test: {
          // Fault injection: each file starts its own PostgreSQL cluster and server process (tests/faults/README.md).
          name: 'faults',
          include: ['tests/faults/**/*.test.ts'],
          environment: 'node',
          fileParallelism: false,
          testTimeout: 120000,
          hookTimeout: 120000,
        },
      },
      {
        extends: true,
        test: {
          // Several processes from the production build, a primary and a hot standby (tests/scaleout/scaleOut.test.ts).
          name: 'scaleout',
          include: ['tests/scaleout/**/*.test.ts'],
          environment: 'node',
          fileParallelism: false,
          testTimeout: 600000,
          hookTimeout: 180000,
        },
      },
      {
        extends: true,
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.e2e.ts'],
          environment: 'node',
          // The seeded template database and the built client, once; then each file's own server on its own copy.
          globalSetup: ['tests/helpers/e2eSetup.ts'],
          setupFiles: ['tests/helpers/e2eServer.ts'],
          fileParallelism: false,
          // Upper bounds for a loaded 2-core machine; the tests wait on what the page shows, never on fixed sleeps.
          testTimeout: 180000,
          hookTimeout: 180000,
        },
      },
    ],
  },
});
