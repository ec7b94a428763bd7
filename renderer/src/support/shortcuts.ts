/**
 * Which plan action a key press asks for: undo (Ctrl+Z), redo (Ctrl+Shift+Z or Ctrl+Y),
 * Cmd instead of Ctrl on macOS; and leg reordering with Alt+ArrowUp/Down on a leg row.
 */
export interface KeyPress {
  key: string;
  ctrlKey: boolean;
  metaKey: boolean;
  shiftKey: boolean;
  altKey: boolean;
}

export type HistoryAction = 'undo' | 'redo' | null;

export function historyActionFor(e: KeyPress): HistoryAction {
  if (!(e.ctrlKey || e.metaKey) || e.altKey) return null;
  const key = e.key.toLowerCase();
  if (key === 'z') return e.shiftKey ? 'redo' : 'undo';
  if (key === 'y' && !e.shiftKey) return 'redo';
  return null;
}

/** −1 (move up), +1 (move down) or 0 for a key press on a leg row. */
export function legMoveFor(e: KeyPress): -1 | 0 | 1 {
  if (!e.altKey || e.ctrlKey || e.metaKey || e.shiftKey) return 0;
  if (e.key === 'ArrowUp') return -1;
  if (e.key === 'ArrowDown') return 1;
  return 0;
}
