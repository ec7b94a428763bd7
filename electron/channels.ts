/**
 * Names of the IPC channels between preload and main, with no dependencies at all:
 * the sandboxed preload bundles this file and may only `require('electron')`.
 * The argument schemas and result types for each channel live in `contract.ts`.
 */

/** Renderer → main requests (ipcRenderer.invoke / ipcMain.handle), one per task. */
export const INVOKE_METHODS = [
  'newPlan',
  'openPlan',
  'openRecent',
  'savePlan',
  'savePlanAs',
  'listRecent',
  'setDirty',
  'autosave',
  'recoverAutosave',
  'discardAutosave',
  'exportPdf',
  'exportCsv',
  'exportGpx',
  'printReport',
  'openOffered',
] as const;

export type InvokeMethod = (typeof INVOKE_METHODS)[number];

/** The wire name of a request channel; prefixed so it cannot collide with Electron's own. */
export function channelOf(method: InvokeMethod): string {
  return `legwise:${method}`;
}

/** Main → renderer: a menu item or shortcut the renderer must act on (it holds the plan). */
export const MENU_COMMAND_CHANNEL = 'legwise:menu-command';

export const SIMPLE_MENU_COMMANDS = [
  'new',
  'open',
  'save',
  'saveAs',
  'exportPdf',
  'exportCsv',
  'exportGpx',
  'print',
  'undo',
  'redo',
  'help',
  // The OS asked to open a file (double-click, command line): the page calls openOffered.
  'openOffered',
] as const;

export type SimpleMenuCommand = (typeof SIMPLE_MENU_COMMANDS)[number];

export type MenuCommand = { kind: SimpleMenuCommand } | { kind: 'openRecent'; filePath: string };

/** Guards what arrives on MENU_COMMAND_CHANNEL before the page's callback sees it. */
export function isMenuCommand(value: unknown): value is MenuCommand {
  if (typeof value !== 'object' || value === null) return false;
  const kind = (value as { kind?: unknown }).kind;
  if (kind === 'openRecent') {
    const filePath = (value as { filePath?: unknown }).filePath;
    return typeof filePath === 'string' && filePath.length > 0;
  }
  return (SIMPLE_MENU_COMMANDS as readonly unknown[]).includes(kind);
}

/** The property of `window` the preload fills. */
export const API_KEY = 'legwise';
