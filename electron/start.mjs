#!/usr/bin/env node
/**
 * `npm start`: the desktop app where Electron can run; otherwise one line saying so
 * and the planner served on http://127.0.0.1 instead. Errors end in one line, never
 * a stack, and the process never waits silently.
 */
import console from 'node:console';
import process from 'node:process';
import path from 'node:path';
import { spawn } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import {
  electronChildEnv,
  ensureBuilt,
  fallbackLine,
  launchDecision,
  resolveElectronDir,
  serveRenderer,
} from './launch.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');

async function serveInBrowser() {
  const server = await serveRenderer({ root, log: (line) => console.log(line) });
  console.log(fallbackLine(server.url));
  const stop = () => void server.close().finally(() => process.exit(0));
  process.once('SIGINT', stop);
  process.once('SIGTERM', stop);
}

async function runDesktop(binary) {
  await ensureBuilt({ root, log: (line) => console.log(line) });
  const { buildElectron } = await import('./build.mjs');
  await buildElectron({ root });
  const child = spawn(binary, [root], { stdio: 'inherit', env: electronChildEnv() });
  let failedToStart = false;
  child.once('error', (error) => {
    failedToStart = true;
    console.log(`Electron could not start (${error.message}).`);
    serveInBrowser().catch(fail);
  });
  child.once('exit', (code, signal) => {
    if (!failedToStart) process.exit(code ?? (signal ? 1 : 0));
  });
}

function fail(error) {
  console.error(
    `Legwise could not start: ${error instanceof Error ? error.message : String(error)}`,
  );
  process.exit(1);
}

const decision = launchDecision({ electronDir: resolveElectronDir(root) });
(decision.mode === 'electron' ? runDesktop(decision.binary) : serveInBrowser()).catch(fail);
