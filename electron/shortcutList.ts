/**
 * Every keyboard shortcut of the planner, in one list: the menu takes its accelerators
 * from here and Help ▸ Keyboard Shortcuts shows the same list, so the two cannot
 * disagree. No dependencies (the page imports it too). `CmdOrCtrl` reads ⌘ on macOS.
 */
export interface Shortcut {
  id: string;
  /** Electron accelerator syntax. */
  accelerator: string;
  /** What it does, in a few words. */
  action: string;
  /** Also accepted (shown after the main one). */
  alternative?: string;
}

export const SHORTCUTS = [
  { id: 'new', accelerator: 'CmdOrCtrl+N', action: 'New plan' },
  { id: 'open', accelerator: 'CmdOrCtrl+O', action: 'Open a plan file' },
  { id: 'save', accelerator: 'CmdOrCtrl+S', action: 'Save' },
  { id: 'saveAs', accelerator: 'CmdOrCtrl+Shift+S', action: 'Save under another name' },
  { id: 'print', accelerator: 'CmdOrCtrl+P', action: 'Print the report' },
  { id: 'exportPdf', accelerator: 'CmdOrCtrl+Shift+P', action: 'Export the report as PDF' },
  { id: 'exportCsv', accelerator: 'CmdOrCtrl+Shift+E', action: 'Export the leg table as CSV' },
  { id: 'undo', accelerator: 'CmdOrCtrl+Z', action: 'Undo the last change to the plan' },
  {
    id: 'redo',
    accelerator: 'CmdOrCtrl+Shift+Z',
    action: 'Redo',
    alternative: 'CmdOrCtrl+Y',
  },
  { id: 'moveLeg', accelerator: 'Alt+Up', action: 'Move the focused leg up (Alt+Down: down)' },
  { id: 'help', accelerator: 'F1', action: 'These shortcuts and the short guide' },
] as const satisfies readonly Shortcut[];

export type ShortcutId = (typeof SHORTCUTS)[number]['id'];

export function acceleratorOf(id: ShortcutId): string {
  const found = SHORTCUTS.find((s) => s.id === id);
  if (!found) throw new Error(`no shortcut ${id}`);
  return found.accelerator;
}

/** "CmdOrCtrl+Shift+S" → "⌘⇧S" on macOS, "Ctrl+Shift+S" elsewhere. */
export function keyLabel(accelerator: string, mac: boolean): string {
  const parts = accelerator.split('+');
  if (!mac) return parts.map((p) => (p === 'CmdOrCtrl' ? 'Ctrl' : p)).join('+');
  const symbols: Record<string, string> = {
    CmdOrCtrl: '⌘',
    Shift: '⇧',
    Alt: '⌥',
    Up: '↑',
    Down: '↓',
  };
  return parts.map((p) => symbols[p] ?? p).join('');
}
