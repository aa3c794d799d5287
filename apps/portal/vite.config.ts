import { fileURLToPath, URL } from 'node:url';
import zlib from 'node:zlib';
import vue from '@vitejs/plugin-vue';
import Components from 'unplugin-vue-components/vite';
import { ElementPlusResolver } from 'unplugin-vue-components/resolvers';
import { defineConfig } from 'vite';
import { compression, defineAlgorithm } from 'vite-plugin-compression2';
import { VitePWA } from 'vite-plugin-pwa';
import { offlineShell } from './build/offlineShell.ts';
import { todayChunks } from './build/todayChunks.ts';
import { TODAY_API_CACHE, TODAY_API_READS } from './src/utils/offlineCache.ts';

const apiPort = process.env.API_PORT ?? '3000';
const shell = offlineShell(/\/(AppLayout|TodayView)\.vue$/);
const src = (file: string) => fileURLToPath(new URL(`./src/${file}`, import.meta.url));
const chunks = todayChunks(src(''), src('main.ts'), [src('layouts/AppLayout.vue'), src('views/TodayView.vue')]);

export default defineConfig(({ mode }) => ({
  root: fileURLToPath(new URL('.', import.meta.url)),
  plugins: [
    vue(),
    // Element Plus components on demand; styles are skipped in component tests (no CSS
    // loader there). By mode, not by VITEST: a build started from a test run keeps its styles.
    Components({
      resolvers: [ElementPlusResolver({ importStyle: mode === 'test' ? false : 'css' })],
      dts: false,
    }),
    shell.plugin,
    chunks.plugin,
    // A brotli and a gzip copy beside each text file, sent by the API as the browser asks
    // (apps/api/src/http/portal.ts), paid once at build time. Brotli at quality 10, not the
    // maximum 11: 2.4 s less CPU per build here for 1.7 % more bytes (4.2 → 1.8 s, 726 → 739 kB).
    compression({
      algorithms: [defineAlgorithm('brotliCompress', { params: { [zlib.constants.BROTLI_PARAM_QUALITY]: 10 } }), 'gzip'],
      threshold: 1024,
      logLevel: 'silent',
    }),
    // The service worker (production builds only; none under `npm run dev`): the app shell
    // and Today open with no signal at all.
    VitePWA({
      registerType: 'autoUpdate',
      // Registered by the app itself once its first page has settled (utils/offlineCache.ts).
      injectRegister: false,
      manifest: false,
      workbox: {
        globPatterns: ['**/*.{js,css,html,woff2,svg}'],
        // Only ever sent by the server for a first visit to /today; the worker answers with index.html.
        globIgnores: ['today.html'],
        importScripts: ['/sw-routes.js'],
        manifestTransforms: [shell.manifestTransform],
        navigateFallback: 'index.html',
        // The API's own pages (photos, the OpenAPI document) are never the app's shell.
        navigateFallbackDenylist: [/^\/api\//],
        cleanupOutdatedCaches: true,
        clientsClaim: true,
        skipWaiting: true,
        runtimeCaching: [
          {
            // Hashed names: a chunk once fetched is the same chunk for ever.
            urlPattern: /\/assets\//,
            handler: 'CacheFirst',
            options: { cacheName: 'swardwise-assets', expiration: { maxEntries: 200 } },
          },
          {
            // Only the reads Today needs, and only GET: each is asked of the network first
            // and answered from the last copy only when there is no connection. Every other
            // API request (and every write) goes to the network untouched.
            urlPattern: TODAY_API_READS,
            method: 'GET',
            handler: 'NetworkFirst',
            options: { cacheName: TODAY_API_CACHE, cacheableResponse: { statuses: [200] }, expiration: { maxEntries: 20 } },
          },
        ],
      },
    }),
  ],
  server: {
    // Fixed: the API accepts writes in development from this origin only (besides PUBLIC_URL).
    port: 5173,
    strictPort: true,
    proxy: { '/api': `http://127.0.0.1:${apiPort}` },
  },
  build: {
    outDir: 'dist',
    emptyOutDir: true,
    chunkSizeWarningLimit: 900,
    rolldownOptions: {
      output: { codeSplitting: { groups: chunks.groups } },
    },
  },
}));
