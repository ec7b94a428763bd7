/**
 * Opening an older plan file shows what updating it changed (the loader's `changes`, e.g.
 * the final reserve now at normal cruise): a short status line and a dismissible list, not a
 * dialog. Through the desktop shell (`window.legwise.openPlan`, electron/document.ts reading
 * the file with electron/files.ts) with a real version-1 file from test/fixtures/plans-v1/.
 */
import { mkdtempSync, copyFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { newPlan } from '../../core/plan/defaults.ts';
import { readPlanFile } from '../../electron/files.ts';
import { createFileActions } from '../../renderer/src/composables/useFiles.ts';
import { createPlanStore } from '../../renderer/src/composables/usePlan.ts';
import { createResultStore } from '../../renderer/src/composables/useResult.ts';
import { createUnits } from '../../renderer/src/composables/useUnits.ts';
import type {} from '../../renderer/src/env.d.ts';

const V1 = fileURLToPath(new URL('../fixtures/plans-v1/piston-tourer.json', import.meta.url));

afterEach(() => vi.unstubAllGlobals());

describe('opening an older plan file', () => {
  it('electron/files.ts hands the migration notes on with the plan', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'legwise-v1-'));
    const path = join(dir, 'tourer.json');
    copyFileSync(V1, path);
    const r = await readPlanFile(path);
    expect(r.ok).toBe(true);
    if (r.ok) {
      expect(r.plan.schemaVersion).toBe(2);
      expect(r.changes.some((c) => /final reserve is now flown at normal cruise/.test(c))).toBe(
        true,
      );
    }
  });

  it('the planner shows the notes, says so in the status line, and lets them be dismissed', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'legwise-v1-'));
    const path = join(dir, 'tourer.json');
    copyFileSync(V1, path);
    const read = await readPlanFile(path);
    if (!read.ok) throw new Error(read.message);
    const api = {
      openPlan: vi.fn(async () => ({
        ok: true as const,
        plan: read.plan,
        warnings: read.warnings,
        changes: read.changes,
        filePath: path,
      })),
    };
    vi.stubGlobal('window', { legwise: api });
    const store = createPlanStore(newPlan());
    const files = createFileActions(
      store,
      createResultStore(store.lastValid, store.valid),
      createUnits(),
    );
    await files.open();
    expect(store.draft.value.name).toBe(read.plan.name);
    expect(files.status.value).toBe(`Opened ${path} (updated from an older plan file).`);
    expect(files.openChanges.value).toEqual(read.changes);
    expect(files.openChanges.value.length).toBeGreaterThan(0);
    files.openChanges.value = []; // what the banner's Dismiss button does
    // a current file shows none
    api.openPlan.mockResolvedValueOnce({
      ok: true,
      plan: newPlan(),
      warnings: [],
      changes: [],
      filePath: '/plans/new.json',
    });
    await files.open();
    expect(files.openChanges.value).toEqual([]);
    expect(files.status.value).toBe('Opened /plans/new.json.');
  });
});
