#!/usr/bin/env node
/**
 * Bundles the `legwise` command (cli/main.ts with core/ and every library it uses) into one
 * ES module, dist-cli/legwise.mjs, with Vite's build API (Rolldown underneath) — the same
 * tool the desktop shell is built with. Only Node's built-ins stay outside the bundle, so
 * the command needs no TypeScript loader and no run-time dependency. `npm ci` runs it
 * through the `prepare` script (offline: nothing is fetched); `npm run build:cli` runs it
 * by hand. Usage: node cli/build.mjs   (or import { buildCli } for tests).
 */
import console from 'node:console';
import process from 'node:process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { builtinModules } from 'node:module';
import { build } from 'vite';

const projectRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');

/**
 * @param {{ root?: string, outDir?: string }} [options]
 * @returns {Promise<string>} absolute path of the bundle
 */
export async function buildCli(options = {}) {
  const root = options.root ?? projectRoot;
  const outDir = path.resolve(root, options.outDir ?? 'dist-cli');
  await build({
    configFile: false,
    root,
    logLevel: 'warn',
    publicDir: false,
    ssr: { noExternal: true, target: 'node' },
    build: {
      ssr: path.join(root, 'cli/main.ts'),
      outDir,
      emptyOutDir: true,
      target: 'node20',
      minify: false,
      sourcemap: false,
      copyPublicDir: false,
      reportCompressedSize: false,
      rolldownOptions: {
        external: [/^node:/, ...builtinModules],
        output: { format: 'es', entryFileNames: 'legwise.mjs', codeSplitting: false },
      },
    },
  });
  return path.join(outDir, 'legwise.mjs');
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  buildCli().then(
    (file) => console.log(`Built ${path.relative(projectRoot, file)}`),
    (error) => {
      console.error(`CLI build failed: ${error instanceof Error ? error.message : String(error)}`);
      process.exitCode = 1;
    },
  );
}
