import { fileURLToPath, URL } from 'node:url';
import vue from '@vitejs/plugin-vue';
import Components from 'unplugin-vue-components/vite';
import { ElementPlusResolver } from 'unplugin-vue-components/resolvers';
import { defineConfig } from 'vite';

const apiPort = process.env.API_PORT ?? '3000';

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
  },
}));
