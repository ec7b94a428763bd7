/**
 * Vite build of the planner page. The page lives in renderer/ and is built to dist/
 * with relative asset paths (base './') so that Electron can load it from file://.
 */
import { fileURLToPath } from 'node:url';
import { defineConfig, type Plugin } from 'vite';
import vue from '@vitejs/plugin-vue';
import { CONTENT_SECURITY_POLICY } from './electron/security.ts';

const projectRoot = fileURLToPath(new URL('.', import.meta.url));

const CSP_META = /(<meta\s+http-equiv="Content-Security-Policy"\s+content=")[^"]*(")/;

/**
 * The source index.html allows ws: for the dev server's hot reload; the built page gets
 * exactly the desktop shell's canonical policy (electron/security.ts), so the two never drift.
 */
export function builtPageCsp(): Plugin {
  return {
    name: 'legwise-built-page-csp',
    apply: 'build',
    transformIndexHtml(html) {
      if (!CSP_META.test(html))
        throw new Error('index.html has no Content-Security-Policy meta tag');
      return html.replace(CSP_META, `$1${CONTENT_SECURITY_POLICY}$2`);
    },
  };
}

export default defineConfig({
  root: fileURLToPath(new URL('./renderer', import.meta.url)),
  base: './',
  plugins: [vue(), builtPageCsp()],
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
