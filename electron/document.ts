/**
 * The open document and the handlers behind every IPC channel: which file the plan
 * belongs to, whether it has unsaved changes, and the open/save/export flows. All
 * Electron calls (dialogs, printing, the window) come in through `ShellPorts`, so
 * this runs and is tested under plain Node.
 */
import path from 'node:path';
import { existsSync } from 'node:fs';
import type { Plan } from '../core/plan/schema.ts';
import {
  failure,
  type Handlers,
  type Outcome,
  type OpenedPlan,
  type RecentFile,
  type SavedFile,
} from './contract.ts';
import type { MenuCommand } from './channels.ts';
import {
  ExternalChangeError,
  addRecent,
  atomicWrite,
  autosavePaths,
  clearAutosave,
  describeFsError,
  isRecent,
  readAutosave,
  readPlanFile,
  readRecent,
  readShellSettings,
  refuseUnloadablePlan,
  removeRecent,
  safeFileName,
  savePlanFile,
  writeAutosave,
  type FileStamp,
  type WriteOps,
} from './files.ts';
import { removeStaleTemps } from './atomicWrite.ts';
import { PLAN_FILE_EXTENSION, isPlanFileName } from './openRequests.ts';

export type SaveKind = 'plan' | 'pdf' | 'csv' | 'gpx';
export type CloseChoice = 'save' | 'discard' | 'cancel';
/** What to do when the file was changed by another program since it was opened. */
export type ChangedOnDiskChoice = 'overwrite' | 'saveAs' | 'reload' | 'cancel';

/** What the document needs from Electron; main.ts supplies dialogs and the window. */
export interface ShellPorts {
  userDataDir: string;
  chooseOpenPath(): Promise<string | null>;
  chooseSavePath(kind: SaveKind, defaultPath: string): Promise<string | null>;
  /** "Discard unsaved changes?" → true to go on. */
  confirmDiscard(): Promise<boolean>;
  /** "Save changes before closing?" */
  askSaveBeforeClose(planName: string): Promise<CloseChoice>;
  /** "Another program changed <file> since you opened it": overwrite, save as, reload? */
  askChangedOnDisk(fileName: string): Promise<ChangedOnDiskChoice>;
  printPdf(): Promise<Uint8Array>;
  /** The system print dialog for the page (its print styles). */
  print(): Promise<void>;
  /** The OS's own recent-documents list (Windows jump list, macOS Open Recent, GNOME). */
  addRecentDocument?(filePath: string): void;
  showTitle(name: string, dirty: boolean, filePath: string | null): void;
  recentChanged(files: RecentFile[]): void;
  sendMenuCommand(command: MenuCommand): void;
  /** Closes the window for good (the close prompt has been answered). */
  closeWindow(): void;
  writeOps?: Partial<WriteOps>;
}

export const PLAN_EXTENSION = PLAN_FILE_EXTENSION;
export const UNTITLED = 'Untitled plan';

export function recentStorePath(userDataDir: string): string {
  return path.join(userDataDir, 'recent.json');
}

export function toRecentFiles(paths: readonly string[]): RecentFile[] {
  return paths.map((filePath) => ({ filePath, name: path.basename(filePath) }));
}

export interface DocumentState {
  filePath: string | null;
  /** Where a save dialog should start for a plan never saved (e.g. a recovered autosave). */
  suggestedPath: string | null;
  name: string;
  dirty: boolean;
  closeAfterSave: boolean;
  /** A file the OS asked us to open, waiting for the page to call openOffered. */
  offered: string | null;
  /** What `filePath` held when it was opened or last saved; checked before each save. */
  stamp: FileStamp | null;
}

export function createDocument(ports: ShellPorts) {
  const state: DocumentState = {
    filePath: null,
    suggestedPath: null,
    name: UNTITLED,
    dirty: false,
    closeAfterSave: false,
    offered: null,
    stamp: null,
  };
  const recentStore = recentStorePath(ports.userDataDir);

  const showTitle = () => ports.showTitle(state.name, state.dirty, state.filePath);
  const publishRecent = (list: string[]) => ports.recentChanged(toRecentFiles(list));

  async function mayDiscard(): Promise<boolean> {
    return !state.dirty || (await ports.confirmDiscard());
  }

  async function openPath(filePath: string): Promise<Outcome<OpenedPlan>> {
    const loaded = await readPlanFile(filePath);
    if (!loaded.ok) return loaded;
    Object.assign(state, {
      filePath,
      suggestedPath: null,
      name: loaded.plan.name,
      dirty: false,
      stamp: loaded.stamp,
    });
    showTitle();
    publishRecent(await addRecent(recentStore, filePath));
    ports.addRecentDocument?.(filePath);
    return {
      ok: true,
      plan: loaded.plan,
      warnings: loaded.warnings,
      changes: loaded.changes,
      filePath,
    };
  }

  /** Another program changed the file: ask, and lose neither version. */
  async function resolveChangedOnDisk(filePath: string, plan: Plan): Promise<Outcome<SavedFile>> {
    const choice = await ports.askChangedOnDisk(path.basename(filePath));
    if (choice === 'overwrite') return writePlan(filePath, plan, { force: true });
    if (choice === 'saveAs') return saveAs(plan);
    if (choice === 'reload') {
      state.closeAfterSave = false;
      const reloaded = await openPath(filePath);
      if (!reloaded.ok) return reloaded;
      return { ok: true, filePath, reloaded };
    }
    state.closeAfterSave = false;
    return failure(
      'CANCELLED',
      `Not saved: ${path.basename(filePath)} was changed by another program.`,
    );
  }

  async function writePlan(
    filePath: string,
    plan: Plan,
    how: { force?: boolean } = {},
  ): Promise<Outcome<SavedFile>> {
    const refused = refuseUnloadablePlan(plan);
    if (refused) {
      state.closeAfterSave = false;
      return refused;
    }
    // Only the file this document came from is checked; a file chosen in Save As was
    // already confirmed for replacing by the save dialog.
    const sameFile =
      state.filePath !== null && path.resolve(state.filePath) === path.resolve(filePath);
    const expect = sameFile && !how.force && state.stamp !== null ? state.stamp : undefined;
    let stamp: FileStamp;
    try {
      const { backupGenerations } = await readShellSettings(ports.userDataDir);
      stamp = await savePlanFile(filePath, plan, {
        generations: backupGenerations,
        ...(expect ? { expect } : {}),
        ...(ports.writeOps ? { ops: ports.writeOps } : {}),
      });
    } catch (error) {
      if (error instanceof ExternalChangeError) return resolveChangedOnDisk(filePath, plan);
      state.closeAfterSave = false;
      return failure(
        'WRITE_FAILED',
        `Could not save ${path.basename(filePath)}: ${describeFsError(error)}.`,
      );
    }
    Object.assign(state, { filePath, suggestedPath: null, name: plan.name, dirty: false, stamp });
    showTitle();
    publishRecent(await addRecent(recentStore, filePath));
    ports.addRecentDocument?.(filePath);
    if (state.closeAfterSave) ports.closeWindow();
    return { ok: true, filePath };
  }

  async function saveAs(plan: Plan): Promise<Outcome<SavedFile>> {
    const refused = refuseUnloadablePlan(plan);
    if (refused) {
      state.closeAfterSave = false;
      return refused;
    }
    const start = state.filePath ?? state.suggestedPath ?? safeFileName(plan.name, PLAN_EXTENSION);
    const target = await ports.chooseSavePath('plan', start);
    if (target === null) {
      state.closeAfterSave = false;
      return failure('CANCELLED', 'Save cancelled.');
    }
    return writePlan(target, plan);
  }

  async function exportBytes(
    kind: SaveKind,
    suggestedName: string,
    produce: () => Promise<Uint8Array | string>,
  ): Promise<Outcome<{ filePath: string }>> {
    // The page may already name the extension ("Coast run.csv"); add it only once.
    const extension = `.${kind}`;
    const stem = suggestedName.toLowerCase().endsWith(extension)
      ? suggestedName.slice(0, -extension.length)
      : suggestedName;
    const target = await ports.chooseSavePath(kind, safeFileName(stem, extension));
    if (target === null) return failure('CANCELLED', 'Export cancelled.');
    try {
      await atomicWrite(target, await produce(), ports.writeOps ? { ops: ports.writeOps } : {});
    } catch (error) {
      return failure(
        'WRITE_FAILED',
        `Could not export ${path.basename(target)}: ${describeFsError(error)}.`,
      );
    }
    return { ok: true, filePath: target };
  }

  const handlers: Handlers = {
    async newPlan() {
      if (!(await mayDiscard())) return failure('CANCELLED', 'Kept the current plan.');
      Object.assign(state, {
        filePath: null,
        suggestedPath: null,
        name: UNTITLED,
        dirty: false,
        stamp: null,
      });
      showTitle();
      return { ok: true };
    },
    async openPlan() {
      if (!(await mayDiscard())) return failure('CANCELLED', 'Kept the current plan.');
      const filePath = await ports.chooseOpenPath();
      return filePath === null ? failure('CANCELLED', 'Open cancelled.') : openPath(filePath);
    },
    async openRecent(filePath) {
      // Only a path the shell itself put on the list: the page cannot name other files.
      if (!(await isRecent(recentStore, filePath)))
        return failure('FORBIDDEN', `${path.basename(filePath)} is not in the recent list.`);
      if (!existsSync(filePath)) {
        publishRecent(await removeRecent(recentStore, filePath));
        return failure(
          'NOT_FOUND',
          `${path.basename(filePath)} no longer exists; removed it from the recent list.`,
        );
      }
      if (!(await mayDiscard())) return failure('CANCELLED', 'Kept the current plan.');
      return openPath(filePath);
    },
    async savePlan(plan) {
      return state.filePath === null ? saveAs(plan) : writePlan(state.filePath, plan);
    },
    savePlanAs: saveAs,
    async listRecent() {
      return { ok: true, files: toRecentFiles(await readRecent(recentStore)) };
    },
    async setDirty({ dirty, name }) {
      Object.assign(state, { dirty, name: name.trim() || UNTITLED });
      showTitle();
      return { ok: true };
    },
    async autosave(plan) {
      const refused = refuseUnloadablePlan(plan);
      if (refused) return refused;
      try {
        await writeAutosave(ports.userDataDir, plan, state.filePath ?? state.suggestedPath);
      } catch (error) {
        return failure('WRITE_FAILED', `Autosave failed: ${describeFsError(error)}.`);
      }
      return { ok: true };
    },
    async recoverAutosave() {
      const recovered = await readAutosave(ports.userDataDir);
      if (recovered?.sourcePath) state.suggestedPath = recovered.sourcePath;
      return { ok: true, recovered };
    },
    async discardAutosave() {
      await clearAutosave(ports.userDataDir);
      return { ok: true };
    },
    async printReport() {
      try {
        await ports.print();
      } catch (error) {
        return failure('INTERNAL', `Printing failed: ${describeFsError(error)}.`);
      }
      return { ok: true };
    },
    async openOffered() {
      const filePath = state.offered;
      if (filePath === null) return failure('NOT_FOUND', 'No file is waiting to be opened.');
      if (!(await mayDiscard())) return failure('CANCELLED', 'Kept the current plan.');
      state.offered = null;
      return openPath(filePath);
    },
    exportPdf: ({ suggestedName }) => exportBytes('pdf', suggestedName, () => ports.printPdf()),
    exportCsv: ({ text, suggestedName }) => exportBytes('csv', suggestedName, async () => text),
    exportGpx: ({ text, suggestedName }) => exportBytes('gpx', suggestedName, async () => text),
  };

  /**
   * The window asks to close. 'close' lets it; 'cancel' keeps it open. Choosing Save
   * asks the page to save (it holds the plan); a successful save then closes.
   */
  async function onCloseRequested(): Promise<'close' | 'cancel'> {
    if (!state.dirty) return 'close';
    const choice = await ports.askSaveBeforeClose(state.name);
    if (choice === 'discard') return 'close';
    if (choice === 'save') {
      state.closeAfterSave = true;
      ports.sendMenuCommand({ kind: 'save' });
    }
    return 'cancel';
  }

  /** After the window has closed on purpose: a clean exit leaves no autosave behind. */
  async function onClosed(): Promise<void> {
    await clearAutosave(ports.userDataDir);
  }

  /**
   * The OS asks to open `filePath` (double-click, `open-file`, command line, a second
   * instance). The page holds the plan, so it is asked to take the file (it may first
   * confirm discarding unsaved changes). Returns false for a name that is not a plan.
   */
  function offerFile(filePath: string): boolean {
    if (!isPlanFileName(filePath)) return false;
    state.offered = path.resolve(filePath);
    ports.sendMenuCommand({ kind: 'openOffered' });
    return true;
  }

  /**
   * On start: temporary files a crashed writer of ours left in the app-data folders and
   * beside the recent plans (each carries its writer's pid; only dead writers' go).
   */
  async function removeOrphanTemps(): Promise<string[]> {
    const recent = await readRecent(recentStore);
    return removeStaleTemps([
      ports.userDataDir,
      autosavePaths(ports.userDataDir).dir,
      ...recent.map((p) => path.dirname(p)),
    ]);
  }

  return {
    handlers,
    offerFile,
    removeOrphanTemps,
    state: state as Readonly<DocumentState>,
    onCloseRequested,
    onClosed,
    listRecent: () => readRecent(recentStore),
  };
}

export type LegwiseDocument = ReturnType<typeof createDocument>;
