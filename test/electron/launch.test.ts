import { spawn } from 'node:child_process';
import { promises as fsp, readFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import {
  electronChildEnv,
  fallbackLine,
  findElectronBinary,
  hasDisplay,
  launchDecision,
  resolveElectronDir,
  serveRenderer,
} from '../../electron/launch.mjs';

const root = fileURLToPath(new URL('../..', import.meta.url));
const electronDir = '/fake/node_modules/electron';

/** A fake file system holding exactly these files. */
function files(contents: Record<string, string>) {
  return {
    exists: (p: string) => p in contents,
    readText: (p: string) => {
      const text = contents[p];
      if (text === undefined) throw new Error(`ENOENT ${p}`);
      return text;
    },
  };
}

describe('is Electron runnable here?', () => {
  it('no path.txt (binary never downloaded) → browser, without touching the network', () => {
    const found = findElectronBinary({ electronDir, env: {}, ...files({}) });
    expect(found).toEqual({
      ok: false,
      reason: 'the Electron binary was never downloaded (no path.txt)',
    });
  });

  it('path.txt naming a binary that is not there → browser', () => {
    const fsView = files({ [`${electronDir}/path.txt`]: 'electron' });
    const found = findElectronBinary({ electronDir, env: {}, ...fsView });
    expect(found.ok).toBe(false);
    expect(!found.ok && found.reason).toContain(`${electronDir}/dist/electron`);
  });

  it('binary present → electron; ELECTRON_OVERRIDE_DIST_PATH is honoured', () => {
    const fsView = files({
      [`${electronDir}/path.txt`]: 'electron\n',
      [`${electronDir}/dist/electron`]: '',
    });
    expect(findElectronBinary({ electronDir, env: {}, ...fsView })).toEqual({
      ok: true,
      binary: `${electronDir}/dist/electron`,
    });
    const override = files({ '/opt/electron/electron': '' });
    expect(
      findElectronBinary({
        electronDir,
        env: { ELECTRON_OVERRIDE_DIST_PATH: '/opt/electron' },
        ...override,
      }),
    ).toEqual({ ok: true, binary: '/opt/electron/electron' });
  });

  it('no electron package at all → browser', () => {
    expect(launchDecision({ electronDir: null, env: {} })).toMatchObject({ mode: 'browser' });
  });

  it('needs a display on Linux, and LEGWISE_BROWSER=1 forces the browser', () => {
    const fsView = files({
      [`${electronDir}/path.txt`]: 'electron',
      [`${electronDir}/dist/electron`]: '',
    });
    const probe = { electronDir, ...fsView };
    expect(launchDecision({ ...probe, platform: 'linux', env: {} })).toMatchObject({
      mode: 'browser',
    });
    expect(launchDecision({ ...probe, platform: 'linux', env: { DISPLAY: ':0' } })).toEqual({
      mode: 'electron',
      binary: `${electronDir}/dist/electron`,
    });
    expect(
      launchDecision({ ...probe, platform: 'darwin', env: { LEGWISE_BROWSER: '1' } }),
    ).toMatchObject({
      mode: 'browser',
    });
    expect(hasDisplay({ platform: 'win32', env: {} })).toBe(true);
  });

  it('finds the installed electron package without running it', () => {
    const dir = resolveElectronDir(root);
    expect(dir && JSON.parse(readFileSync(path.join(dir, 'package.json'), 'utf8')).name).toBe(
      'electron',
    );
    expect(resolveElectronDir(os.tmpdir())).toBeNull();
  });

  it('never lets the Electron child run as plain Node', () => {
    expect(electronChildEnv({ ELECTRON_RUN_AS_NODE: '1', HOME: '/h' })).toEqual({ HOME: '/h' });
  });
});

describe('serving the planner in the browser', () => {
  let dir: string;
  beforeEach(async () => {
    dir = await fsp.mkdtemp(path.join(os.tmpdir(), 'legwise-serve-'));
  });
  afterEach(async () => {
    await fsp.rm(dir, { recursive: true, force: true });
  });

  it('serves dist/ with vite preview on 127.0.0.1 when the UI is built', async () => {
    await fsp.mkdir(path.join(dir, 'dist'));
    await fsp.writeFile(
      path.join(dir, 'dist', 'index.html'),
      '<!doctype html><title>built page</title>',
    );
    const server = await serveRenderer({ root: dir, configFile: false });
    try {
      expect(server.kind).toBe('preview');
      expect(server.url).toMatch(/^http:\/\/127\.0\.0\.1:\d+$/);
      expect(await (await fetch(`${server.url}/`)).text()).toContain('built page');
    } finally {
      await server.close();
    }
  });

  it('never serves the dev server: with nothing built it builds dist/ first', async () => {
    await fsp.writeFile(path.join(dir, 'index.html'), '<!doctype html><title>source page</title>');
    const lines: string[] = [];
    const server = await serveRenderer({ root: dir, configFile: false, log: (l) => lines.push(l) });
    try {
      expect(server.kind).toBe('preview');
      expect(server.built).toBe(true);
      expect(lines).toEqual(['Building the planner UI (dist/) …']);
      await fsp.access(path.join(dir, 'dist', 'index.html'));
      const page = await (await fetch(`${server.url}/`)).text();
      expect(page).toContain('source page');
      // The dev server would inject its client script into every page (Vite docs, HMR).
      expect(page).not.toContain('/@vite/client');
    } finally {
      await server.close();
    }
  });

  it('npm start prints one line and serves the page when Electron cannot run', async () => {
    const child = spawn(process.execPath, [path.join(root, 'electron', 'start.mjs')], {
      cwd: root,
      env: { ...process.env, LEGWISE_BROWSER: '1' },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let stdout = '';
    let stderr = '';
    child.stderr.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
    try {
      const line = await new Promise<string>((resolve, reject) => {
        child.stdout.on('data', (chunk: Buffer) => {
          stdout += chunk.toString();
          // A build line may come first when dist/ is missing; then the one fallback line.
          const lines = stdout.split('\n').filter((l) => !l.startsWith('Building the planner'));
          const first = lines[0];
          if (lines.length > 1 && first !== undefined) resolve(first);
        });
        child.once('exit', (code) => reject(new Error(`start.mjs exited (${code}): ${stderr}`)));
      });
      const url = /at (http:\/\/127\.0\.0\.1:\d+) instead$/.exec(line)?.[1];
      expect(line).toBe(fallbackLine(url ?? '?'));
      const page = await fetch(`${url}/`);
      expect(page.status).toBe(200);
      expect(await page.text()).toMatch(/<html/i);
      expect(stderr).not.toMatch(/\n\s+at /);
    } finally {
      child.kill('SIGTERM');
    }
  });
});
