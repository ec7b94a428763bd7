/**
 * What `npm start` does, as small functions start.mjs wires together: decide whether
 * the Electron binary can run here, and otherwise serve the planner in the browser.
 *
 * Deliberately never `require('electron')`: when its binary is missing, electron's
 * index.js tries to download it, and Legwise makes no network requests.
 */
import process from 'node:process';
import fs from 'node:fs';
import path from 'node:path';
import { createRequire } from 'node:module';

/** The one line printed when the desktop app cannot start here. */
export function fallbackLine(url) {
  return `Electron is not available on this machine; serving the planner at ${url} instead`;
}

/** Folder of the installed electron package, or null (resolves package.json only, runs nothing). */
export function resolveElectronDir(projectRoot) {
  try {
    const require = createRequire(path.join(projectRoot, 'package.json'));
    return path.dirname(require.resolve('electron/package.json'));
  } catch {
    return null;
  }
}

/**
 * Where the electron package says its binary is, mirroring electron/index.js without
 * its download: `path.txt` names the executable inside `dist/` (or inside
 * ELECTRON_OVERRIDE_DIST_PATH). Returns { ok: true, binary } or { ok: false, reason }.
 */
export function findElectronBinary({
  electronDir,
  env = process.env,
  exists = fs.existsSync,
  readText = readTextFile,
}) {
  if (!electronDir) return { ok: false, reason: 'the electron package is not installed' };
  const pathFile = path.join(electronDir, 'path.txt');
  const executable = exists(pathFile) ? readText(pathFile).trim() : '';
  let binary;
  if (env.ELECTRON_OVERRIDE_DIST_PATH)
    binary = path.join(env.ELECTRON_OVERRIDE_DIST_PATH, executable || 'electron');
  else if (executable) binary = path.join(electronDir, 'dist', executable);
  else return { ok: false, reason: 'the Electron binary was never downloaded (no path.txt)' };
  return exists(binary)
    ? { ok: true, binary }
    : { ok: false, reason: `the Electron binary is missing (${binary})` };
}

function readTextFile(file) {
  return fs.readFileSync(file, 'utf8');
}

/** On Linux a window needs an X11 or Wayland display; elsewhere assume a desktop. */
export function hasDisplay({ platform = process.platform, env = process.env } = {}) {
  if (platform !== 'linux') return true;
  return Boolean(env.DISPLAY || env.WAYLAND_DISPLAY);
}

/**
 * The launch decision: { mode: 'electron', binary } or { mode: 'browser', reason }.
 * LEGWISE_BROWSER=1 asks for the browser even where Electron could run.
 */
export function launchDecision({
  electronDir,
  platform = process.platform,
  env = process.env,
  exists,
  readText,
}) {
  if (env.LEGWISE_BROWSER === '1') return { mode: 'browser', reason: 'LEGWISE_BROWSER=1' };
  const found = findElectronBinary({ electronDir, env, exists, readText });
  if (!found.ok) return { mode: 'browser', reason: found.reason };
  if (!hasDisplay({ platform, env }))
    return { mode: 'browser', reason: 'no display (DISPLAY/WAYLAND_DISPLAY unset)' };
  return { mode: 'electron', binary: found.binary };
}

function firstLocalUrl(server) {
  const url = server.resolvedUrls?.local[0];
  if (!url) throw new Error('the local server did not report its address');
  return url.replace(/\/$/, '');
}

const CONFIG_NAMES = ['vite.config.ts', 'vite.config.mts', 'vite.config.js', 'vite.config.mjs'];

/**
 * Vite options naming the project. With the project's config file, its own `root`
 * (renderer/) must win, so no inline root is passed (inline options override the file).
 */
export function viteProject(root, configFile) {
  if (configFile === false) return { root, configFile: false };
  const found =
    configFile ??
    CONFIG_NAMES.map((name) => path.join(root, name)).find((file) => fs.existsSync(file));
  return found ? { configFile: found } : { root, configFile: false };
}

/** Builds the planner into dist/ (vite build) when dist/index.html is missing. */
export async function ensureBuilt({ root, configFile, log = () => undefined } = {}) {
  if (fs.existsSync(path.join(root, 'dist', 'index.html'))) return false;
  log('Building the planner UI (dist/) …');
  const vite = await import('vite');
  await vite.build({ ...viteProject(root, configFile), logLevel: 'warn' });
  return true;
}

/**
 * Serves the built planner (dist/) on 127.0.0.1 with `vite preview`, building it first
 * if needed. Never the Vite dev server: that serves the whole project folder and an
 * open-in-editor endpoint. Resolves to { url, kind: 'preview', built, close }.
 */
export async function serveRenderer({ root, configFile, port, log } = {}) {
  const built = await ensureBuilt({ root, configFile, log });
  const vite = await import('vite');
  const listen = {
    host: '127.0.0.1',
    strictPort: false,
    open: false,
    ...(port === undefined ? {} : { port }),
  };
  const server = await vite.preview({
    ...viteProject(root, configFile),
    logLevel: 'warn',
    preview: listen,
  });
  return { url: firstLocalUrl(server), kind: 'preview', built, close: () => server.close() };
}

/** The environment for the Electron child: never "run as node". */
export function electronChildEnv(env = process.env) {
  const out = { ...env };
  delete out.ELECTRON_RUN_AS_NODE;
  return out;
}
