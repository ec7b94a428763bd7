/**
 * The GPX route export of the file actions: through `window.legwise.exportGpx` (a save dialog)
 * inside the desktop shell, as a browser download otherwise, and from the shell's menu command.
 */
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { newPlan } from '../../core/plan/defaults.ts';
import { parseGpx } from '../../core/route/gpx.ts';
import type { Plan } from '../../core/plan/schema.ts';
import type { LegwiseApi, MenuCommand } from '../../electron/contract.ts';
import { createFileActions } from '../../renderer/src/composables/useFiles.ts';
import { createPlanStore } from '../../renderer/src/composables/usePlan.ts';
import { createResultStore } from '../../renderer/src/composables/useResult.ts';
import { createUnits } from '../../renderer/src/composables/useUnits.ts';
import { download } from '../../renderer/src/support/download.ts';
import { fileStem } from '../../renderer/src/support/csv.ts';
import { runsPlan } from './routePlans.ts';
// The page's `window.legwise` typing, which the Node type-check (tsconfig.node.json) leaves out.
import type {} from '../../renderer/src/env.d.ts';

vi.mock('../../renderer/src/support/download.ts', () => ({ download: vi.fn() }));

type ExportGpx = LegwiseApi['exportGpx'];

/** Just the parts of `window.legwise` the route export and the menu wiring use. */
function fakeApi(exportGpx: ExportGpx) {
  const menu: { callback?: (command: MenuCommand) => void } = {};
  const api = {
    exportGpx: vi.fn(exportGpx),
    recoverAutosave: vi.fn(async () => ({ ok: true as const, recovered: null })),
    setDirty: vi.fn(async () => ({ ok: true as const })),
    onMenuCommand: vi.fn((callback: (command: MenuCommand) => void) => {
      menu.callback = callback;
      return () => undefined;
    }),
  };
  return { api, menu };
}

function actions(plan: Plan) {
  const store = createPlanStore(plan);
  return createFileActions(store, createResultStore(store.lastValid, store.valid), createUnits());
}

const saved =
  (filePath: string): ExportGpx =>
  async () => ({ ok: true, filePath });

beforeEach(() => vi.mocked(download).mockClear());
afterEach(() => vi.unstubAllGlobals());

describe('route export inside the desktop shell', () => {
  it('sends the route as GPX to exportGpx with the plan’s name and says where it went', async () => {
    const { api } = fakeApi(saved('/plans/route.gpx'));
    vi.stubGlobal('window', { legwise: api });
    const plan = runsPlan();
    const files = actions(plan);
    expect(await files.exportRoute()).toBe('saved');
    expect(download).not.toHaveBeenCalled();
    const sent = api.exportGpx.mock.calls[0]?.[0];
    expect(sent?.suggestedName).toBe(`${fileStem(plan.name)}.gpx`);
    const back = parseGpx(sent?.text ?? '');
    // The fixture's route has 3 waypoints (test/renderer/routePlans.ts).
    expect(back.ok && back.route.waypoints.map((w) => w.name)).toEqual(['P', 'Q', 'R']);
    expect(files.status.value).toMatch(/^Route saved to \/plans\/route\.gpx, with the time/);
  });

  it('leaves the status alone when the save dialog is cancelled and reports a failed write', async () => {
    const cancelled: ExportGpx = async () => ({
      ok: false,
      code: 'CANCELLED',
      message: 'Export cancelled.',
    });
    vi.stubGlobal('window', { legwise: fakeApi(cancelled).api });
    const files = actions(runsPlan());
    files.status.value = 'before';
    expect(await files.exportGpx('<gpx/>', 'r.gpx')).toBe('cancelled');
    expect(files.status.value).toBe('before');

    const refused: ExportGpx = async () => ({
      ok: false,
      code: 'WRITE_FAILED',
      message: 'Could not export r.gpx: disk full.',
    });
    vi.stubGlobal('window', { legwise: fakeApi(refused).api });
    const again = actions(runsPlan());
    expect(await again.exportGpx('<gpx/>', 'r.gpx')).toBe('failed');
    expect(again.status.value).toBe('Could not export r.gpx: disk full.');
  });

  it('exports the route when the menu sends exportGpx', async () => {
    const { api, menu } = fakeApi(saved('/plans/route.gpx'));
    vi.stubGlobal('window', { legwise: api });
    const files = actions(runsPlan());
    const stop = files.start();
    menu.callback?.({ kind: 'exportGpx' });
    await vi.waitFor(() => expect(api.exportGpx).toHaveBeenCalledTimes(1));
    await vi.waitFor(() => expect(files.status.value).toMatch(/^Route saved to/));
    stop();
  });

  it('says so instead of exporting a plan without a route', async () => {
    const { api } = fakeApi(saved('/plans/route.gpx'));
    vi.stubGlobal('window', { legwise: api });
    const files = actions(newPlan());
    expect(await files.exportRoute()).toBe('failed');
    expect(api.exportGpx).not.toHaveBeenCalled();
    expect(files.status.value).toMatch(/^No route to export/);
  });
});

describe('route export in a plain browser', () => {
  it('downloads the GPX when there is no desktop API', async () => {
    vi.stubGlobal('window', {});
    const plan = runsPlan();
    const files = actions(plan);
    expect(await files.exportRoute()).toBe('saved');
    expect(download).toHaveBeenCalledWith(
      expect.stringContaining('<gpx'),
      `${fileStem(plan.name)}.gpx`,
      'application/gpx+xml',
    );
    expect(files.status.value).toMatch(/^Route downloaded as GPX/);
  });
});
