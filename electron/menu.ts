/**
 * The application menu as a pure function of the platform, following each OS's
 * convention (macOS: an app menu named after the app holding About and Quit, and a
 * Window menu; Windows/Linux: Quit/Exit at the end of File, About under Help).
 * Shortcuts use CmdOrCtrl so they read ⌘ on macOS and Ctrl elsewhere.
 */
import type { MenuItemConstructorOptions } from 'electron';
import type { MenuCommand, SimpleMenuCommand } from './channels.ts';
import type { RecentFile } from './contract.ts';
import { acceleratorOf } from './shortcutList.ts';

export interface MenuHandlers {
  /** Forward a command to the page (it holds the plan). */
  command(command: MenuCommand): void;
  about(): void;
  quit(): void;
  /** File ▸ Backups to Keep: how many earlier versions a save keeps beside the plan. */
  setBackups?(generations: number): void;
}

export interface MenuOptions {
  appName: string;
  recent: readonly RecentFile[];
  /** Developer tools only while developing; never in a packaged app. */
  devTools: boolean;
  /** The current backup setting (shell-settings.json), shown as the checked choice. */
  backupGenerations?: number;
}

/** The choices File ▸ Backups to Keep offers (any 0–20 can be set in shell-settings.json). */
export const BACKUP_CHOICES = [0, 1, 3, 5, 10] as const;

function backupsSubmenu(
  handlers: MenuHandlers,
  current: number | undefined,
): MenuItemConstructorOptions[] {
  return BACKUP_CHOICES.map((n) => ({
    label: n === 0 ? 'None' : n === 1 ? '1 earlier version' : `${n} earlier versions`,
    type: 'radio' as const,
    checked: n === current,
    click: () => handlers.setBackups?.(n),
  }));
}

/** The menu's shortcuts, from the one list Help shows (shortcutList.ts). */
export const ACCELERATORS = {
  new: acceleratorOf('new'),
  open: acceleratorOf('open'),
  save: acceleratorOf('save'),
  saveAs: acceleratorOf('saveAs'),
  print: acceleratorOf('print'),
  exportPdf: acceleratorOf('exportPdf'),
  exportCsv: acceleratorOf('exportCsv'),
  undo: acceleratorOf('undo'),
  redo: acceleratorOf('redo'),
  help: acceleratorOf('help'),
} as const;

/** Quit shortcut per platform (Windows names it Exit and closes with Alt+F4). */
export function quitAccelerator(platform: NodeJS.Platform): string {
  if (platform === 'darwin') return 'Cmd+Q';
  if (platform === 'win32') return 'Alt+F4';
  return 'Ctrl+Q';
}

function recentSubmenu(
  handlers: MenuHandlers,
  recent: readonly RecentFile[],
): MenuItemConstructorOptions[] {
  if (recent.length === 0) return [{ label: 'No recent plans', enabled: false }];
  return recent.map((file) => ({
    label: file.name,
    toolTip: file.filePath,
    click: () => handlers.command({ kind: 'openRecent', filePath: file.filePath }),
  }));
}

function fileMenu(
  platform: NodeJS.Platform,
  handlers: MenuHandlers,
  options: MenuOptions,
): MenuItemConstructorOptions {
  const send = (kind: SimpleMenuCommand) => () => handlers.command({ kind });
  const items: MenuItemConstructorOptions[] = [
    { label: 'New Plan', accelerator: ACCELERATORS.new, click: send('new') },
    { label: 'Open…', accelerator: ACCELERATORS.open, click: send('open') },
    { label: 'Open Recent', submenu: recentSubmenu(handlers, options.recent) },
    { type: 'separator' },
    { label: 'Save', accelerator: ACCELERATORS.save, click: send('save') },
    { label: 'Save As…', accelerator: ACCELERATORS.saveAs, click: send('saveAs') },
    ...(handlers.setBackups
      ? [
          {
            label: 'Backups to Keep',
            submenu: backupsSubmenu(handlers, options.backupGenerations),
          },
        ]
      : []),
    { type: 'separator' },
    { label: 'Print…', accelerator: ACCELERATORS.print, click: send('print') },
    {
      label: 'Export Report as PDF…',
      accelerator: ACCELERATORS.exportPdf,
      click: send('exportPdf'),
    },
    {
      label: 'Export Results as CSV…',
      accelerator: ACCELERATORS.exportCsv,
      click: send('exportCsv'),
    },
    { label: 'Export Route as GPX…', click: send('exportGpx') },
  ];
  if (platform === 'darwin') items.push({ type: 'separator' }, { role: 'close' });
  else {
    items.push(
      { type: 'separator' },
      {
        label: platform === 'win32' ? 'Exit' : 'Quit',
        accelerator: quitAccelerator(platform),
        click: handlers.quit,
      },
    );
  }
  return { label: 'File', submenu: items };
}

/**
 * Undo and Redo act on the plan's history (the page holds it), not on the text of one
 * box. Off macOS the page itself answers the keys (useShortcuts), so the menu shows them
 * without registering them — one key press, one undo.
 */
function editMenu(platform: NodeJS.Platform, handlers: MenuHandlers): MenuItemConstructorOptions {
  const registerAccelerator = platform === 'darwin';
  return {
    label: 'Edit',
    submenu: [
      {
        label: 'Undo',
        accelerator: ACCELERATORS.undo,
        registerAccelerator,
        click: () => handlers.command({ kind: 'undo' }),
      },
      {
        label: 'Redo',
        accelerator: ACCELERATORS.redo,
        registerAccelerator,
        click: () => handlers.command({ kind: 'redo' }),
      },
      { type: 'separator' },
      { role: 'cut' },
      { role: 'copy' },
      { role: 'paste' },
      { role: 'selectAll' },
    ],
  };
}

function helpMenu(
  handlers: MenuHandlers,
  about: MenuItemConstructorOptions | null,
): MenuItemConstructorOptions {
  const items: MenuItemConstructorOptions[] = [
    {
      label: 'Keyboard Shortcuts and Guide',
      accelerator: ACCELERATORS.help,
      click: () => handlers.command({ kind: 'help' }),
    },
  ];
  if (about) items.push({ type: 'separator' }, about);
  return { role: 'help', label: 'Help', submenu: items };
}

function viewMenu(options: MenuOptions): MenuItemConstructorOptions {
  const items: MenuItemConstructorOptions[] = [
    { role: 'resetZoom' },
    { role: 'zoomIn' },
    { role: 'zoomOut' },
    { type: 'separator' },
    { role: 'togglefullscreen' },
  ];
  if (options.devTools)
    items.push({ type: 'separator' }, { role: 'reload' }, { role: 'toggleDevTools' });
  return { label: 'View', submenu: items };
}

export function buildMenuTemplate(
  platform: NodeJS.Platform,
  handlers: MenuHandlers,
  options: MenuOptions,
): MenuItemConstructorOptions[] {
  const about: MenuItemConstructorOptions = {
    label: `About ${options.appName}`,
    click: handlers.about,
  };
  const edit = editMenu(platform, handlers);
  if (platform === 'darwin') {
    return [
      {
        label: options.appName,
        submenu: [
          about,
          { type: 'separator' },
          { role: 'services' },
          { type: 'separator' },
          { role: 'hide' },
          { role: 'hideOthers' },
          { role: 'unhide' },
          { type: 'separator' },
          {
            label: `Quit ${options.appName}`,
            accelerator: quitAccelerator(platform),
            click: handlers.quit,
          },
        ],
      },
      fileMenu(platform, handlers, options),
      edit,
      viewMenu(options),
      { role: 'windowMenu' },
      helpMenu(handlers, null),
    ];
  }
  return [
    fileMenu(platform, handlers, options),
    edit,
    viewMenu(options),
    helpMenu(handlers, about),
  ];
}
