/**
 * Registers one ipcMain handler per contract channel. Each request passes three
 * gates before its handler runs (Electron security checklist: validate the sender of
 * every IPC message):
 * the sender must be our own page's top frame, the channel must be in the contract,
 * and the arguments must pass the channel's zod schema. Refusals and handler errors
 * come back as `{ ok: false, code, message }`; no stack crosses IPC.
 */
import type { IpcMain, IpcMainInvokeEvent } from 'electron';
import type { z } from 'zod';
import { INVOKE_METHODS, channelOf, type InvokeMethod } from './channels.ts';
import { contract, failure, type Failure, type Handlers } from './contract.ts';

/** Where our page is allowed to come from. */
export interface TrustedPage {
  /** URL of the built renderer's index.html (legwise://app/index.html). */
  indexUrl: string;
  /** Vite dev server URL, only while developing. */
  devServerUrl?: string;
}

export interface SenderInfo {
  url: string | undefined;
  isMainFrame: boolean;
}

export function isTrustedSender(sender: SenderInfo, trust: TrustedPage): boolean {
  if (!sender.isMainFrame || !sender.url) return false;
  let url: URL;
  try {
    url = new URL(sender.url);
  } catch {
    return false;
  }
  const index = new URL(trust.indexUrl);
  if (url.protocol === index.protocol && index.protocol !== 'http:' && index.protocol !== 'https:')
    return url.host === index.host && url.pathname === index.pathname;
  if (trust.devServerUrl === undefined) return false;
  return (
    (url.protocol === 'http:' || url.protocol === 'https:') &&
    url.origin === new URL(trust.devServerUrl).origin
  );
}

export function isInvokeMethod(name: string): name is InvokeMethod {
  return (INVOKE_METHODS as readonly string[]).includes(name);
}

/** The first few zod issues as `argument path: message`, one line. */
export function describeArgIssues(error: z.ZodError): string {
  const shown = error.issues.slice(0, 3).map((issue) => {
    const [index, ...rest] = issue.path;
    const where =
      index === undefined
        ? 'arguments'
        : `argument ${Number(index) + 1}${rest.length ? ` at ${rest.join('.')}` : ''}`;
    return `${where}: ${issue.message}`;
  });
  const more = error.issues.length > 3 ? ` (and ${error.issues.length - 3} more)` : '';
  return shown.join('; ') + more;
}

/** The whole request path as a pure function of its inputs, tested without Electron. */
export async function dispatch(
  method: string,
  sender: SenderInfo,
  rawArgs: readonly unknown[],
  handlers: Handlers,
  trust: TrustedPage,
): Promise<unknown> {
  if (!isTrustedSender(sender, trust)) {
    return failure(
      'FORBIDDEN',
      `Refused ${method}: the request did not come from the Legwise page.`,
    );
  }
  if (!isInvokeMethod(method))
    return failure('UNKNOWN_CHANNEL', `Refused ${method}: no such request.`);
  const parsed = contract[method].args.safeParse(rawArgs);
  if (!parsed.success) {
    return failure(
      'BAD_ARGS',
      `Invalid arguments for ${method}: ${describeArgIssues(parsed.error)}`,
    );
  }
  const handler = handlers[method] as (...args: readonly unknown[]) => Promise<unknown>;
  try {
    return await handler(...(parsed.data as readonly unknown[]));
  } catch (error) {
    return internalFailure(method, error);
  }
}

function internalFailure(method: string, error: unknown): Failure {
  return failure(
    'INTERNAL',
    `${method} failed: ${error instanceof Error ? error.message : String(error)}`,
  );
}

export function senderInfo(event: Pick<IpcMainInvokeEvent, 'senderFrame'>): SenderInfo {
  const frame = event.senderFrame;
  return { url: frame?.url, isMainFrame: frame != null && frame.parent === null };
}

/** Wires every contract channel; returns a function that removes them again. */
export function registerIpc(
  ipcMain: Pick<IpcMain, 'handle' | 'removeHandler'>,
  handlers: Handlers,
  trust: TrustedPage,
): () => void {
  for (const method of INVOKE_METHODS) {
    ipcMain.handle(channelOf(method), (event, ...args: unknown[]) =>
      dispatch(method, senderInfo(event), args, handlers, trust),
    );
  }
  return () => {
    for (const method of INVOKE_METHODS) ipcMain.removeHandler(channelOf(method));
  };
}
