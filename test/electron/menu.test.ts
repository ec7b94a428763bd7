import type { MenuItemConstructorOptions } from 'electron';
import { describe, expect, it, vi } from 'vitest';
import { buildMenuTemplate, type MenuHandlers } from '../../electron/menu.ts';

function handlers() {
  return { command: vi.fn(), about: vi.fn(), quit: vi.fn() } satisfies MenuHandlers;
}

/** Every item of the template, depth first. */
function items(template: MenuItemConstructorOptions[]): MenuItemConstructorOptions[] {
  return template.flatMap((item) => [
    item,
    ...(Array.isArray(item.submenu) ? items(item.submenu) : []),
  ]);
}
const byLabel = (template: MenuItemConstructorOptions[], label: string) =>
  items(template).find((item) => item.label === label);
const click = (item: MenuItemConstructorOptions | undefined) =>
  (item?.click as (() => void) | undefined)?.();

const options = { appName: 'Legwise', recent: [], devTools: false };

describe('buildMenuTemplate', () => {
  it('uses CmdOrCtrl shortcuts for the file commands on every platform', () => {
    for (const platform of ['darwin', 'linux', 'win32'] as const) {
      const t = buildMenuTemplate(platform, handlers(), options);
      expect(byLabel(t, 'New Plan')?.accelerator).toBe('CmdOrCtrl+N');
      expect(byLabel(t, 'Open…')?.accelerator).toBe('CmdOrCtrl+O');
      expect(byLabel(t, 'Save')?.accelerator).toBe('CmdOrCtrl+S');
      expect(byLabel(t, 'Save As…')?.accelerator).toBe('CmdOrCtrl+Shift+S');
      // Ctrl+P prints (the convention of every desktop program); PDF export keeps a shortcut.
      expect(byLabel(t, 'Print…')?.accelerator).toBe('CmdOrCtrl+P');
      expect(byLabel(t, 'Export Report as PDF…')?.accelerator).toBe('CmdOrCtrl+Shift+P');
    }
  });

  it('Edit ▸ Undo/Redo go to the plan history; the page answers the keys off macOS', () => {
    for (const platform of ['darwin', 'linux', 'win32'] as const) {
      const h = handlers();
      const t = buildMenuTemplate(platform, h, options);
      const undo = byLabel(t, 'Undo');
      const redo = byLabel(t, 'Redo');
      expect(undo?.accelerator).toBe('CmdOrCtrl+Z');
      expect(redo?.accelerator).toBe('CmdOrCtrl+Shift+Z');
      expect(undo?.role).toBeUndefined(); // not the text box's own undo
      expect(undo?.registerAccelerator).toBe(platform === 'darwin');
      click(undo);
      click(redo);
      expect(h.command).toHaveBeenNthCalledWith(1, { kind: 'undo' });
      expect(h.command).toHaveBeenNthCalledWith(2, { kind: 'redo' });
      click(byLabel(t, 'Print…'));
      click(byLabel(t, 'Keyboard Shortcuts and Guide'));
      expect(h.command).toHaveBeenNthCalledWith(3, { kind: 'print' });
      expect(h.command).toHaveBeenNthCalledWith(4, { kind: 'help' });
      const roles = items(t).map((i) => i.role);
      expect(roles).toEqual(expect.arrayContaining(['cut', 'copy', 'paste', 'selectAll']));
    }
  });

  it('offers Export Route as GPX… after the CSV export, without a shortcut', () => {
    for (const platform of ['darwin', 'linux', 'win32'] as const) {
      const h = handlers();
      const t = buildMenuTemplate(platform, h, options);
      const file = t.find((m) => m.label === 'File')?.submenu as MenuItemConstructorOptions[];
      const labels = file.map((i) => i.label);
      const gpx = labels.indexOf('Export Route as GPX…');
      expect(gpx, platform).toBe(labels.indexOf('Export Results as CSV…') + 1);
      expect(file[gpx]?.accelerator).toBeUndefined();
      click(file[gpx]);
      expect(h.command).toHaveBeenCalledWith({ kind: 'exportGpx' });
    }
  });

  it('on macOS puts About and Quit (Cmd+Q) in an app menu named Legwise', () => {
    const t = buildMenuTemplate('darwin', handlers(), options);
    expect(t[0]?.label).toBe('Legwise');
    const appMenu = t[0]?.submenu as MenuItemConstructorOptions[];
    expect(appMenu.map((i) => i.label ?? i.role)).toEqual(
      expect.arrayContaining(['About Legwise', 'services', 'hide', 'Quit Legwise']),
    );
    expect(byLabel(t, 'Quit Legwise')?.accelerator).toBe('Cmd+Q');
    expect(byLabel(t, 'Quit')).toBeUndefined();
    expect(t.some((m) => m.role === 'windowMenu')).toBe(true);
  });

  it('on Linux ends File with Quit (Ctrl+Q) and has About under Help', () => {
    const t = buildMenuTemplate('linux', handlers(), options);
    expect(t.map((m) => m.label ?? m.role)).toEqual(['File', 'Edit', 'View', 'Help']);
    const file = t[0]?.submenu as MenuItemConstructorOptions[];
    expect(file.at(-1)).toMatchObject({ label: 'Quit', accelerator: 'Ctrl+Q' });
    expect(byLabel(t, 'About Legwise')).toBeDefined();
  });

  it('on Windows names it Exit with Alt+F4', () => {
    const file = buildMenuTemplate('win32', handlers(), options)[0]
      ?.submenu as MenuItemConstructorOptions[];
    expect(file.at(-1)).toMatchObject({ label: 'Exit', accelerator: 'Alt+F4' });
  });

  it('forwards menu commands to the page and lists recent files', () => {
    const h = handlers();
    const recent = [{ filePath: '/plans/coast.legwise.json', name: 'coast.legwise.json' }];
    const t = buildMenuTemplate('linux', h, { ...options, recent });
    click(byLabel(t, 'Save As…'));
    click(byLabel(t, 'coast.legwise.json'));
    click(byLabel(t, 'Quit'));
    expect(h.command).toHaveBeenNthCalledWith(1, { kind: 'saveAs' });
    expect(h.command).toHaveBeenNthCalledWith(2, {
      kind: 'openRecent',
      filePath: '/plans/coast.legwise.json',
    });
    expect(h.quit).toHaveBeenCalled();
    expect(byLabel(buildMenuTemplate('linux', h, options), 'No recent plans')?.enabled).toBe(false);
  });

  it('offers developer tools only while developing', () => {
    const roles = (devTools: boolean) =>
      items(buildMenuTemplate('linux', handlers(), { ...options, devTools })).map((i) => i.role);
    expect(roles(false)).not.toContain('toggleDevTools');
    expect(roles(true)).toContain('toggleDevTools');
  });

  it('File ▸ Backups to Keep shows the setting and changes it', () => {
    const h = { ...handlers(), setBackups: vi.fn() };
    const t = buildMenuTemplate('linux', h, { ...options, backupGenerations: 3 });
    const sub = byLabel(t, 'Backups to Keep')?.submenu as MenuItemConstructorOptions[];
    expect(sub.map((i) => i.label)).toEqual([
      'None',
      '1 earlier version',
      '3 earlier versions',
      '5 earlier versions',
      '10 earlier versions',
    ]);
    expect(sub.filter((i) => i.checked).map((i) => i.label)).toEqual(['3 earlier versions']);
    click(sub[3]);
    expect(h.setBackups).toHaveBeenCalledWith(5);
  });
});
