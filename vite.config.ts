import vue from '@vitejs/plugin-vue';
import { defineConfig } from 'vite';
import { precompress } from './scripts/precompress.ts';

const apiPort = process.env.PORT ?? '3000';

// The web app's source lives in apps/web/src; the repo root is Vite's root so index.html stays at the top.
export default defineConfig({
  plugins: [vue(), precompress()],
  publicDir: 'apps/web/public',
  resolve: { dedupe: ['vue'] },
  build: { outDir: 'dist/web', emptyOutDir: true, chunkSizeWarningLimit: 1500 },
  server: {
    port: 5173,
    // Keep the browser's Host header: the API's forgery check compares it with Origin.
    proxy: { '/api': { target: `http://localhost:${apiPort}`, changeOrigin: false } },
  },
});
