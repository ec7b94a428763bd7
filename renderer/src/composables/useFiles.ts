/**
 * New, open, save, CSV and GPX export, printed report and crash insurance. Inside the desktop
 * shell these go through `window.legwise` (dialogs, atomic writes, PDF); in a plain browser
 * they fall back to a file picker, downloads, localStorage and the print dialog.
 */
import { nextTick, ref, watch, type Ref } from 'vue';
import { newPlan } from '../../../core/plan/defaults.ts';
import {
  parsePlanBytes,
  parsePlanText,
  serializePlan,
  type PlanIssue,
} from '../../../core/plan/load.ts';
import type { Plan } from '../../../core/plan/schema.ts';
import type { MenuCommand } from '../../../electron/contract.ts';
import type { PlanStore } from './usePlan.ts';
import type { ResultStore } from './useResult.ts';
import type { Units } from './useUnits.ts';
import { buildLegCsv, fileStem } from '../support/csv.ts';
import { readSetting, writeSetting } from '../support/settingsStore.ts';
import { download } from '../support/download.ts';
import { routeGpx } from '../support/routeExport.ts';

/** How an export ended; `status` says where the file went or why not (unchanged if cancelled). */
export type ExportOutcome = 'saved' | 'failed' | 'cancelled';

export interface FileActions {
  /** One line on what the last action did (shown in the status area). */
  status: Ref<string>;
  /** Problems of a plan file that could not be opened. */
  openIssues: Ref<PlanIssue[]>;
  /** What updating an older plan file changed (the loader's `changes`), until dismissed. */
  openChanges: Ref<string[]>;
  /** A plan autosaved by an earlier session, offered back. */
  recovered: Ref<Plan | null>;
  newPlan(): Promise<void>;
  open(): Promise<void>;
  save(as?: boolean): Promise<void>;
  exportCsv(): Promise<void>;
  /** Saves GPX text through the shell's save dialog, or as a browser download. */
  exportGpx(text: string, name: string): Promise<ExportOutcome>;
  /** Exports the plan's route as GPX, with estimates at the waypoints when it can. */
  exportRoute(): Promise<ExportOutcome>;
  /** Exports the report as a PDF file (the shell), or opens the print dialog (a browser). */
  printReport(): Promise<void>;
  /** The system print dialog for the report. */
  print(): Promise<void>;
  /** Help ▸ Keyboard Shortcuts and Guide asks for the help panel. */
  helpOpen: Ref<boolean>;
  restoreRecovered(): void;
  discardRecovered(): Promise<void>;
  /** Starts autosave and menu handling; returns a stop function. */
  start(): () => void;
}

const AUTOSAVE_KEY = 'autosave';
/**
 * Sent on window before and after printing: the report is built only for paper (it repeats
 * the table and draws the profile as an image, which would cost time on every keystroke).
 */
export const PREPARE_PRINT_EVENT = 'legwise:prepare-print';
export const PRINT_DONE_EVENT = 'legwise:print-done';
const AUTOSAVE_DELAY_MS = 2000;

/** The chosen file's bytes: decoded strictly by parsePlanBytes, never as lossy text. */
function pickFileBytes(): Promise<{ name: string; bytes: Uint8Array } | null> {
  return new Promise((resolve) => {
    const input = document.createElement('input');
    input.type = 'file';
    input.accept = '.legwise,.json,application/json';
    input.addEventListener('change', () => {
      const file = input.files?.[0];
      if (!file) return resolve(null);
      file.arrayBuffer().then(
        (buffer) => resolve({ name: file.name, bytes: new Uint8Array(buffer) }),
        () => resolve(null),
      );
    });
    input.addEventListener('cancel', () => resolve(null));
    input.click();
  });
}

/** How long a status message stays (it clears itself; common practice for such notices). */
export const STATUS_CLEAR_MS = 6000;

export function createFileActions(plan: PlanStore, result: ResultStore, units: Units): FileActions {
  const api = window.legwise;
  const status = ref('');
  // A status message clears itself; a newer one restarts the clock.
  let statusTimer: ReturnType<typeof setTimeout> | undefined;
  watch(status, (text) => {
    clearTimeout(statusTimer);
    if (text) {
      statusTimer = setTimeout(() => {
        if (status.value === text) status.value = '';
      }, STATUS_CLEAR_MS);
    }
  });
  const openIssues = ref<PlanIssue[]>([]);
  const openChanges = ref<string[]>([]);
  const recovered = ref<Plan | null>(null);
  const helpOpen = ref(false);

  const ensureValid = (what: string): Plan | null => {
    if (plan.valid.value) return plan.lastValid.value;
    status.value = `Cannot ${what}: fix the marked fields first.`;
    return null;
  };

  const opened = (p: Plan, where: string, changes: readonly string[] = []) => {
    plan.load(p);
    openIssues.value = [];
    openChanges.value = [...changes];
    status.value =
      changes.length > 0
        ? `Opened ${where} (updated from an older plan file).`
        : `Opened ${where}.`;
  };

  async function newPlanAction(): Promise<void> {
    if (api) {
      const r = await api.newPlan();
      if (!r.ok) return void (r.code !== 'CANCELLED' && (status.value = r.message));
    }
    plan.load(newPlan());
    status.value = 'New plan.';
  }

  async function open(): Promise<void> {
    if (api) {
      const r = await api.openPlan();
      if (r.ok) return opened(r.plan, r.filePath, r.changes);
      if (r.code === 'CANCELLED') return;
      openIssues.value = r.issues ?? [];
      status.value = r.message;
      return;
    }
    const picked = await pickFileBytes();
    if (!picked) return;
    const loaded = parsePlanBytes(picked.bytes);
    if (loaded.ok) opened(loaded.plan, picked.name, loaded.changes);
    else {
      openIssues.value = loaded.issues;
      status.value = `${picked.name} is not a plan this version can open.`;
    }
  }

  async function save(as = false): Promise<void> {
    const p = ensureValid('save');
    if (!p) return;
    if (api) {
      const r = as ? await api.savePlanAs(p) : await api.savePlan(p);
      if (r.ok && r.reloaded) {
        opened(r.reloaded.plan, r.reloaded.filePath, r.reloaded.changes);
        status.value = `Reloaded ${r.filePath} as another program left it; nothing was saved.`;
      } else if (r.ok) {
        plan.markSaved();
        status.value = `Saved to ${r.filePath}.`;
      } else if (r.code !== 'CANCELLED') status.value = r.message;
      return;
    }
    download(serializePlan(p), `${fileStem(p.name)}.legwise`, 'application/json');
    plan.markSaved();
    status.value = 'Plan downloaded.';
  }

  async function exportCsv(): Promise<void> {
    const r = result.result.value;
    if (!r) return void (status.value = 'Nothing to export yet.');
    const text = buildLegCsv(plan.lastValid.value, r, units.system.value);
    const name = `${fileStem(plan.lastValid.value.name)}.csv`;
    if (api) {
      const out = await api.exportCsv({ text, suggestedName: name });
      if (out.ok) status.value = `Table saved to ${out.filePath}.`;
      else if (out.code !== 'CANCELLED') status.value = out.message;
      return;
    }
    download(text, name, 'text/csv');
    status.value = 'Table downloaded as CSV.';
  }

  /** `detail` follows the "saved to …" part of the status line. */
  async function saveGpx(text: string, name: string, detail = ''): Promise<ExportOutcome> {
    if (api) {
      const out = await api.exportGpx({ text, suggestedName: name });
      if (out.ok) {
        status.value = `Route saved to ${out.filePath}${detail}.`;
        return 'saved';
      }
      if (out.code === 'CANCELLED') return 'cancelled';
      status.value = out.message;
      return 'failed';
    }
    download(text, name, 'application/gpx+xml');
    status.value = `Route downloaded as GPX${detail}.`;
    return 'saved';
  }

  async function exportRoute(): Promise<ExportOutcome> {
    const p = plan.lastValid.value;
    if (!p.route) {
      status.value = plan.draft.value.route
        ? 'Cannot export the route: fix the marked fields first.'
        : 'No route to export: add waypoints on the Route tab first.';
      return 'failed';
    }
    const gpx = routeGpx(p, result.result.value);
    const detail = gpx.withEstimates
      ? ', with the time and fuel or charge expected at each waypoint'
      : ', without estimates: some waypoint is not reached by a flown leg';
    return saveGpx(gpx.text, `${fileStem(p.name)}.gpx`, detail);
  }

  async function printReport(): Promise<void> {
    const name = `${fileStem(plan.lastValid.value.name)}.pdf`;
    // The shell prints to PDF without a beforeprint event, and window.print() blocks before
    // Vue could render on beforeprint: build the report first in both cases.
    window.dispatchEvent(new Event(PREPARE_PRINT_EVENT));
    await nextTick();
    try {
      if (api) {
        const out = await api.exportPdf({ suggestedName: name });
        if (out.ok) status.value = `Report saved to ${out.filePath}.`;
        else if (out.code !== 'CANCELLED') status.value = out.message;
      } else window.print();
    } finally {
      window.dispatchEvent(new Event(PRINT_DONE_EVENT));
    }
  }

  /** Ctrl+P / File ▸ Print: the report on paper through the system's print dialog. */
  async function print(): Promise<void> {
    window.dispatchEvent(new Event(PREPARE_PRINT_EVENT));
    await nextTick();
    try {
      if (api) {
        const out = await api.printReport();
        if (!out.ok) status.value = out.message;
      } else window.print();
    } finally {
      window.dispatchEvent(new Event(PRINT_DONE_EVENT));
    }
  }

  async function openOffered(): Promise<void> {
    if (!api) return;
    const r = await api.openOffered();
    if (r.ok) return opened(r.plan, r.filePath, r.changes);
    if (r.code === 'CANCELLED') return;
    openIssues.value = r.issues ?? [];
    status.value = r.message;
  }

  function restoreRecovered(): void {
    if (recovered.value) plan.load(recovered.value, { unsaved: true });
    recovered.value = null;
    status.value = 'Autosaved plan restored.';
  }

  async function discardRecovered(): Promise<void> {
    recovered.value = null;
    if (api) await api.discardAutosave();
    else writeSetting(AUTOSAVE_KEY, null);
  }

  async function lookForAutosave(): Promise<void> {
    if (api) {
      const r = await api.recoverAutosave();
      if (r.ok && r.recovered) recovered.value = r.recovered.plan;
      return;
    }
    const text = readSetting(AUTOSAVE_KEY);
    if (!text) return;
    const loaded = parsePlanText(text);
    if (loaded.ok && serializePlan(loaded.plan) !== serializePlan(plan.lastValid.value))
      recovered.value = loaded.plan;
  }

  function onMenu(command: MenuCommand): void {
    const run: Record<MenuCommand['kind'], () => Promise<void>> = {
      new: newPlanAction,
      open,
      save: () => save(false),
      saveAs: () => save(true),
      exportPdf: printReport,
      exportCsv,
      exportGpx: async () => void (await exportRoute()),
      print,
      undo: async () => plan.undo(),
      redo: async () => plan.redo(),
      help: async () => void (helpOpen.value = true),
      openOffered,
      openRecent: async () => {
        if (!api || command.kind !== 'openRecent') return;
        const r = await api.openRecent(command.filePath);
        if (r.ok) opened(r.plan, r.filePath, r.changes);
        else status.value = r.message;
      },
    };
    void run[command.kind]();
  }

  function start(): () => void {
    void lookForAutosave();
    let timer: ReturnType<typeof setTimeout> | undefined;
    const stopAutosave = watch(plan.draft, () => {
      clearTimeout(timer);
      timer = setTimeout(() => {
        if (!plan.dirty.value || recovered.value) return;
        const p = plan.lastValid.value;
        if (api) void api.autosave(p);
        else writeSetting(AUTOSAVE_KEY, serializePlan(p));
      }, AUTOSAVE_DELAY_MS);
    });
    const stopDirty = api
      ? watch(
          [plan.dirty, () => plan.draft.value.name],
          ([dirty, name]) => void api.setDirty({ dirty, name: String(name).slice(0, 200) }),
          { immediate: true },
        )
      : () => undefined;
    const stopMenu = api ? api.onMenuCommand(onMenu) : () => undefined;
    return () => {
      clearTimeout(timer);
      stopAutosave();
      stopDirty();
      stopMenu();
    };
  }

  return {
    status,
    openChanges,
    openIssues,
    recovered,
    newPlan: newPlanAction,
    open,
    save,
    exportCsv,
    exportGpx: (text, name) => saveGpx(text, name),
    exportRoute,
    printReport,
    print,
    helpOpen,
    restoreRecovered,
    discardRecovered,
    start,
  };
}
