#!/usr/bin/env node
/**
 * Bundles the Electron main process and preload from TypeScript into dist-electron/
 * with Vite's build API (Rolldown underneath):
 *   main.js    — ES module (package.json is "type": "module"; Electron ≥ 28 loads ESM main),
 *                everything bundled except electron and Node's built-ins;
 *   preload.js — CommonJS, because a sandboxed preload is run as a plain script and may
 *                only require('electron').
 * Usage: node electron/build.mjs   (or import { buildElectron } for tests / start.mjs).
 */
import console from 'node:console';
import process from 'node:process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { builtinModules } from 'node:module';
import { build } from 'vite';

const projectRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const nodeBuiltins = [/^node:/, ...builtinModules];

/** @param {{ entry: string, fileName: string, format: 'es' | 'cjs', external: (string | RegExp)[], root: string, outDir: string }} o */
function bundle(o) {
  return build({
    configFile: false,
    root: o.root,
    logLevel: 'warn',
    publicDir: false,
    // Bundle every dependency (zod, core/) into the file; nothing is resolved at run time.
    ssr: { noExternal: true, target: 'node' },
    build: {
      ssr: path.join(o.root, o.entry),
      outDir: o.outDir,
      emptyOutDir: false,
      target: 'node22',
      minify: false,
      sourcemap: false,
      copyPublicDir: false,
      reportCompressedSize: false,
      rolldownOptions: {
        external: o.external,
        output: { format: o.format, entryFileNames: o.fileName, codeSplitting: false },
      },
    },
  });
}

/**
 * @param {{ root?: string, outDir?: string }} [options]
 * @returns {Promise<{ main: string, preload: string }>} absolute paths of the two bundles
 */
export async function buildElectron(options = {}) {
  const root = options.root ?? projectRoot;
  const outDir = path.resolve(root, options.outDir ?? 'dist-electron');
  await bundle({
    root,
    outDir,
    entry: 'electron/main.ts',
    fileName: 'main.js',
    format: 'es',
    external: ['electron', ...nodeBuiltins],
  });
  await bundle({
    root,
    outDir,
    entry: 'electron/preload.ts',
    fileName: 'preload.js',
    format: 'cjs',
    external: ['electron'],
  });
  return { main: path.join(outDir, 'main.js'), preload: path.join(outDir, 'preload.js') };
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  buildElectron().then(
    (out) =>
      console.log(
        `Built ${path.relative(projectRoot, out.main)} and ${path.relative(projectRoot, out.preload)}`,
      ),
    (error) => {
      console.error(
        `Electron build failed: ${error instanceof Error ? error.message : String(error)}`,
      );
      process.exitCode = 1;
    },
  );
}
