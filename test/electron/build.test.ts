import { promises as fsp } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import vm from 'node:vm';
import { builtinModules } from 'node:module';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { newPlan } from '../../core/plan/defaults.ts';
import { INVOKE_METHODS, MENU_COMMAND_CHANNEL, channelOf } from '../../electron/channels.ts';
import type { LegwiseApi } from '../../electron/contract.ts';
import { buildElectron } from '../../electron/build.mjs';

let outDir: string;
let built: { main: string; preload: string };
beforeAll(async () => {
  outDir = await fsp.mkdtemp(path.join(os.tmpdir(), 'legwise-electron-build-'));
  built = await buildElectron({ outDir });
});
afterAll(async () => {
  await fsp.rm(outDir, { recursive: true, force: true });
});

/** Block and line comments removed (they may mention require() in prose). */
function withoutComments(code: string): string {
  return code.replace(/\/\*[\s\S]*?\*\//g, '').replace(/^\s*\/\/.*$/gm, '');
}

/** Runs the bundled preload the way Electron runs a sandboxed one: a plain script given `require`. */
function runSandboxedPreload(code: string) {
  const exposed = new Map<string, unknown>();
  const listeners = new Map<string, (...args: unknown[]) => void>();
  const electron = {
    contextBridge: { exposeInMainWorld: (key: string, api: unknown) => exposed.set(key, api) },
    ipcRenderer: {
      invoke: vi.fn(async () => ({ ok: true })),
      on: (channel: string, fn: (...args: unknown[]) => void) => listeners.set(channel, fn),
      removeListener: (channel: string) => listeners.delete(channel),
    },
  };
  const requested: string[] = [];
  const sandboxRequire = (name: string) => {
    requested.push(name);
    if (name !== 'electron') throw new Error(`a sandboxed preload cannot require ${name}`);
    return electron;
  };
  const module = { exports: {} };
  const wrapper = vm.runInNewContext(`(function (require, module, exports) {\n${code}\n})`, {});
  wrapper(sandboxRequire, module, module.exports);
  return { exposed, listeners, electron, requested };
}

describe('electron/build.mjs', () => {
  it('produces dist-electron/main.js and preload.js', async () => {
    expect(path.basename(built.main)).toBe('main.js');
    expect(path.basename(built.preload)).toBe('preload.js');
    expect((await fsp.stat(built.main)).size).toBeGreaterThan(0);
  });

  it('bundles main as an ES module that imports only electron and Node built-ins', async () => {
    const code = await fsp.readFile(built.main, 'utf8');
    const imports = [...code.matchAll(/^import\s[^'"]*?from\s+["']([^"']+)["'];?$/gm)].map(
      (m) => m[1] ?? '',
    );
    expect(imports).toContain('electron');
    const allowed = (name: string) =>
      name === 'electron' || name.startsWith('node:') || builtinModules.includes(name);
    expect(imports.filter((name) => !allowed(name))).toEqual([]);
    expect(withoutComments(code)).not.toMatch(/\brequire\(/);
  });

  it('bundles a CommonJS preload that runs sandboxed and needs only electron', async () => {
    const code = await fsp.readFile(built.preload, 'utf8');
    expect(withoutComments(code)).not.toMatch(/^\s*(import|export)\s/m);
    const { exposed, requested } = runSandboxedPreload(code);
    expect([...new Set(requested)]).toEqual(['electron']);
    const api = exposed.get('legwise') as Record<string, unknown>;
    expect(Object.keys(api).sort()).toEqual([...INVOKE_METHODS, 'onMenuCommand'].sort());
    expect(code).not.toContain('zod');
  });

  it('binds each window.legwise method to its one channel', async () => {
    const { exposed, electron } = runSandboxedPreload(await fsp.readFile(built.preload, 'utf8'));
    const api = exposed.get('legwise') as LegwiseApi;
    const plan = newPlan();
    await api.savePlan(plan);
    await api.openRecent('/plans/a.legwise.json');
    await api.exportCsv({ text: 'a,b\n', suggestedName: 'r' });
    await api.exportGpx({ text: '<gpx/>', suggestedName: 'r.gpx' });
    await api.listRecent();
    expect(electron.ipcRenderer.invoke.mock.calls).toEqual([
      [channelOf('savePlan'), plan],
      [channelOf('openRecent'), '/plans/a.legwise.json'],
      [channelOf('exportCsv'), { text: 'a,b\n', suggestedName: 'r' }],
      [channelOf('exportGpx'), { text: '<gpx/>', suggestedName: 'r.gpx' }],
      [channelOf('listRecent')],
    ]);
  });

  it('passes menu commands to the page without the IPC event, and drops malformed ones', async () => {
    const { exposed, listeners } = runSandboxedPreload(await fsp.readFile(built.preload, 'utf8'));
    const api = exposed.get('legwise') as LegwiseApi;
    const seen: unknown[] = [];
    const unsubscribe = api.onMenuCommand((command) => seen.push(command));
    const deliver = listeners.get(MENU_COMMAND_CHANNEL);
    const event = { sender: 'ipc internals' };
    deliver?.(event, { kind: 'save' });
    deliver?.(event, { kind: 'exportGpx' });
    deliver?.(event, { kind: 'openRecent', filePath: '/plans/b.legwise.json' });
    deliver?.(event, { kind: 'format-disk' });
    deliver?.(event, 'save');
    expect(seen).toEqual([
      { kind: 'save' },
      { kind: 'exportGpx' },
      { kind: 'openRecent', filePath: '/plans/b.legwise.json' },
    ]);
    unsubscribe();
    expect(listeners.has(MENU_COMMAND_CHANNEL)).toBe(false);
  });
});
