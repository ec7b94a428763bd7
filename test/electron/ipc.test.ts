import { describe, expect, it, vi } from 'vitest';
import { newPlan } from '../../core/plan/defaults.ts';
import { INVOKE_METHODS, channelOf } from '../../electron/channels.ts';
import { contract, type Handlers } from '../../electron/contract.ts';
import {
  dispatch,
  isTrustedSender,
  registerIpc,
  senderInfo,
  type TrustedPage,
} from '../../electron/ipc.ts';

const trust: TrustedPage = { indexUrl: 'legwise://app/index.html' };
const ourPage = {
  url: 'legwise://app/index.html#/results',
  isMainFrame: true,
};

function fakeHandlers(): Handlers {
  const ok = vi.fn(async () => ({ ok: true as const }));
  return Object.fromEntries(INVOKE_METHODS.map((m) => [m, ok])) as unknown as Handlers;
}

describe('the contract', () => {
  it('declares exactly the channels the preload binds', () => {
    expect(Object.keys(contract).sort()).toEqual([...INVOKE_METHODS].sort());
  });
});

describe('dispatch', () => {
  it('passes validated arguments to the handler', async () => {
    const handlers = fakeHandlers();
    const plan = newPlan();
    const result = await dispatch('savePlan', ourPage, [plan], handlers, trust);
    expect(result).toEqual({ ok: true });
    expect(handlers.savePlan).toHaveBeenCalledWith(plan);
  });

  it('refuses an unknown channel', async () => {
    const result = await dispatch('runShell', ourPage, ['rm -rf /'], fakeHandlers(), trust);
    expect(result).toMatchObject({ ok: false, code: 'UNKNOWN_CHANNEL' });
  });

  it('refuses bad arguments with BAD_ARGS and never calls the handler', async () => {
    const handlers = fakeHandlers();
    const broken = { ...newPlan(), legs: [] };
    const cases: [string, unknown[]][] = [
      ['savePlan', [broken]],
      ['savePlan', []],
      ['openRecent', [42]],
      ['openRecent', ['']],
      ['setDirty', [{ dirty: 'yes', name: 'x' }]],
      ['exportCsv', [{ text: 5, suggestedName: 'r' }]],
      ['exportGpx', [{ text: 5, suggestedName: 'r' }]],
      ['exportGpx', [{ text: '<gpx/>' }]],
      ['exportGpx', [{ text: '<gpx/>', suggestedName: 'r'.repeat(201) }]],
      // One character over the contract's text limit (electron/contract.ts, MAX_TEXT_CHARS).
      ['exportGpx', [{ text: 'x'.repeat(20_000_001), suggestedName: 'r' }]],
      ['exportGpx', []],
      ['listRecent', ['extra']],
    ];
    for (const [method, args] of cases) {
      const result = await dispatch(method, ourPage, args, handlers, trust);
      expect(result, method).toMatchObject({ ok: false, code: 'BAD_ARGS' });
    }
    for (const m of INVOKE_METHODS) expect(handlers[m]).not.toHaveBeenCalled();
    const legs = await dispatch('savePlan', ourPage, [broken], handlers, trust);
    expect((legs as { message: string }).message).toMatch(/argument 1 at legs/);
  });

  it('refuses senders other than our own page’s top frame', async () => {
    const handlers = fakeHandlers();
    const senders = [
      { url: 'https://example.com/', isMainFrame: true },
      { url: 'file:///home/someone/evil.html', isMainFrame: true },
      { url: 'legwise://app/other.html', isMainFrame: true },
      { url: 'legwise://evil/index.html', isMainFrame: true },
      { url: ourPage.url, isMainFrame: false },
      { url: undefined, isMainFrame: true },
      { url: 'not a url', isMainFrame: true },
      { url: 'http://127.0.0.1:5173/', isMainFrame: true }, // a dev server, but not trusted here
    ];
    for (const sender of senders) {
      const result = await dispatch('listRecent', sender, [], handlers, trust);
      expect(result, String(sender.url)).toMatchObject({ ok: false, code: 'FORBIDDEN' });
    }
    expect(handlers.listRecent).not.toHaveBeenCalled();
  });

  it('trusts the dev server origin only while developing', () => {
    const dev = { ...trust, devServerUrl: 'http://127.0.0.1:5173/' };
    expect(isTrustedSender({ url: 'http://127.0.0.1:5173/#/plan', isMainFrame: true }, dev)).toBe(
      true,
    );
    expect(isTrustedSender({ url: 'http://127.0.0.1:5174/', isMainFrame: true }, dev)).toBe(false);
    expect(isTrustedSender({ url: 'http://localhost:5173/', isMainFrame: true }, dev)).toBe(false);
  });

  it('turns a throwing handler into an INTERNAL failure without a stack', async () => {
    const handlers = fakeHandlers();
    handlers.listRecent = async () => {
      throw new Error('disk on fire');
    };
    const result = await dispatch('listRecent', ourPage, [], handlers, trust);
    expect(result).toEqual({
      ok: false,
      code: 'INTERNAL',
      message: 'listRecent failed: disk on fire',
    });
  });
});

describe('registerIpc', () => {
  it('registers one handler per contract channel, guarded by the sender check', async () => {
    const registered = new Map<string, (event: unknown, ...args: unknown[]) => Promise<unknown>>();
    const ipcMain = {
      handle: vi.fn(
        (channel: string, fn: (event: unknown, ...args: unknown[]) => Promise<unknown>) => {
          registered.set(channel, fn);
        },
      ),
      removeHandler: vi.fn((channel: string) => void registered.delete(channel)),
    };
    const unregister = registerIpc(ipcMain as never, fakeHandlers(), trust);
    expect([...registered.keys()].sort()).toEqual(INVOKE_METHODS.map(channelOf).sort());

    const listRecent = registered.get(channelOf('listRecent'));
    const fromUs = { senderFrame: { url: ourPage.url, parent: null } };
    const fromFrame = { senderFrame: { url: ourPage.url, parent: {} } };
    expect(await listRecent?.(fromUs)).toEqual({ ok: true });
    expect(await listRecent?.(fromFrame)).toMatchObject({ code: 'FORBIDDEN' });
    expect(await listRecent?.({ senderFrame: null })).toMatchObject({ code: 'FORBIDDEN' });
    unregister();
    expect(registered.size).toBe(0);
  });

  it('reads the sender from the frame that sent the message', () => {
    expect(senderInfo({ senderFrame: null })).toEqual({ url: undefined, isMainFrame: false });
  });
});
