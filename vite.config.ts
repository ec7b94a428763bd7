/**
 * Vite build of the planner page. The page lives in renderer/ and is built to dist/
 * with relative asset paths (base './') so that Electron can load it from file://.
 */
import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vite';
import vue from '@vitejs/plugin-vue';

const projectRoot = fileURLToPath(new URL('.', import.meta.url));

export default defineConfig({
  root: fileURLToPath(new URL('./renderer', import.meta.url)),
  base: './',
  plugins: [vue()],
  build: {
    outDir: fileURLToPath(new URL('./dist', import.meta.url)),
    emptyOutDir: true,
    // The page runs offline from disk: no CDN, everything in the bundle.
    assetsInlineLimit: 0,
    chunkSizeWarningLimit: 1200,
  },
  server: {
    // The page imports core/ and examples/ from outside renderer/.
    fs: { allow: [projectRoot] },
  },
});
