/**
 * The window's size and position, remembered between sessions in
 * `<userData>/window-state.json`. A saved position is used only if most of the window
 * lands on a display that exists now (a laptop undocked from its second screen must not
 * open the window off-screen); otherwise the saved size is centred by the OS.
 */
import { promises as fsp } from 'node:fs';
import path from 'node:path';
import { z } from 'zod';
import { atomicWrite } from './atomicWrite.ts';

export interface Rect {
  x: number;
  y: number;
  width: number;
  height: number;
}

const int = z.number().int().min(-100_000).max(100_000);
export const WindowStateSchema = z.object({
  x: int,
  y: int,
  width: z.number().int().min(200).max(100_000),
  height: z.number().int().min(200).max(100_000),
  maximized: z.boolean(),
});
export type WindowState = z.infer<typeof WindowStateSchema>;

export function windowStatePath(userDataDir: string): string {
  return path.join(userDataDir, 'window-state.json');
}

function overlapArea(a: Rect, b: Rect): number {
  const w = Math.min(a.x + a.width, b.x + b.width) - Math.max(a.x, b.x);
  const h = Math.min(a.y + a.height, b.y + b.height) - Math.max(a.y, b.y);
  return w > 0 && h > 0 ? w * h : 0;
}

/**
 * Bounds for the new window from the saved state and today's displays' work areas:
 * the saved rectangle if at least half of it is on one display; the saved size (shrunk
 * to fit the largest display) without a position otherwise; null with nothing saved.
 */
export function boundsToRestore(
  saved: WindowState | null,
  workAreas: readonly Rect[],
): { bounds: Partial<Rect> & { width: number; height: number }; maximized: boolean } | null {
  if (saved === null) return null;
  const rect: Rect = { x: saved.x, y: saved.y, width: saved.width, height: saved.height };
  const visible = workAreas.some(
    (area) => overlapArea(rect, area) >= (rect.width * rect.height) / 2,
  );
  if (visible) return { bounds: rect, maximized: saved.maximized };
  const widest = workAreas.reduce<Rect | null>(
    (a, b) => (a === null || b.width * b.height > a.width * a.height ? b : a),
    null,
  ) ?? { x: 0, y: 0, width: saved.width, height: saved.height };
  return {
    bounds: {
      width: Math.min(saved.width, widest.width),
      height: Math.min(saved.height, widest.height),
    },
    maximized: saved.maximized,
  };
}

export async function readWindowState(userDataDir: string): Promise<WindowState | null> {
  try {
    const raw: unknown = JSON.parse(await fsp.readFile(windowStatePath(userDataDir), 'utf8'));
    const parsed = WindowStateSchema.safeParse(raw);
    return parsed.success ? parsed.data : null;
  } catch {
    return null;
  }
}

/** Rounds and validates; a state that would not read back is not written. */
export async function writeWindowState(userDataDir: string, state: WindowState): Promise<boolean> {
  const parsed = WindowStateSchema.safeParse({
    ...state,
    x: Math.round(state.x),
    y: Math.round(state.y),
    width: Math.round(state.width),
    height: Math.round(state.height),
  });
  if (!parsed.success) return false;
  await fsp.mkdir(userDataDir, { recursive: true });
  await atomicWrite(windowStatePath(userDataDir), `${JSON.stringify(parsed.data)}\n`);
  return true;
}
