/**
 * Native dialogs behind the document's ports: open/save pickers with our file
 * filters, and the two questions about unsaved changes. Thin wrappers over
 * Electron's `dialog`, kept apart so `document.ts` stays free of Electron.
 */
import path from 'node:path';
import { app, dialog, type BrowserWindow, type FileFilter } from 'electron';
import type { ChangedOnDiskChoice, CloseChoice, SaveKind, ShellPorts } from './document.ts';

const FILTERS: Record<SaveKind, FileFilter[]> = {
  plan: [{ name: 'Legwise plan', extensions: ['legwise'] }],
  pdf: [{ name: 'PDF document', extensions: ['pdf'] }],
  csv: [{ name: 'CSV table', extensions: ['csv'] }],
  gpx: [{ name: 'GPX route', extensions: ['gpx'] }],
};

type DialogPorts = Pick<
  ShellPorts,
  'chooseOpenPath' | 'chooseSavePath' | 'confirmDiscard' | 'askSaveBeforeClose' | 'askChangedOnDisk'
>;

/** Button order of the changed-on-disk question; the answer is an index into it. */
export const CHANGED_ON_DISK_CHOICES: readonly ChangedOnDiskChoice[] = [
  'saveAs',
  'overwrite',
  'reload',
  'cancel',
];

export function dialogPorts(getWindow: () => BrowserWindow | null): DialogPorts {
  const parent = () => getWindow() ?? undefined;
  return {
    async chooseOpenPath() {
      const options = {
        title: 'Open plan',
        // Plans of earlier versions were `.legwise.json`: those open too.
        filters: [{ name: 'Legwise plan', extensions: ['legwise', 'json'] }],
        properties: ['openFile' as const],
      };
      const win = parent();
      const result = win
        ? await dialog.showOpenDialog(win, options)
        : await dialog.showOpenDialog(options);
      return result.canceled ? null : (result.filePaths[0] ?? null);
    },
    async chooseSavePath(kind, defaultPath) {
      const start = path.isAbsolute(defaultPath)
        ? defaultPath
        : path.join(app.getPath('documents'), defaultPath);
      const options = {
        title: kind === 'plan' ? 'Save plan' : 'Export',
        defaultPath: start,
        filters: FILTERS[kind],
      };
      const win = parent();
      const result = win
        ? await dialog.showSaveDialog(win, options)
        : await dialog.showSaveDialog(options);
      return result.canceled || !result.filePath ? null : result.filePath;
    },
    async confirmDiscard() {
      const options = {
        type: 'warning' as const,
        buttons: ['Discard Changes', 'Cancel'],
        defaultId: 1,
        cancelId: 1,
        message: 'The current plan has unsaved changes.',
        detail: 'Discard them?',
      };
      const win = parent();
      const { response } = win
        ? await dialog.showMessageBox(win, options)
        : await dialog.showMessageBox(options);
      return response === 0;
    },
    async askSaveBeforeClose(planName): Promise<CloseChoice> {
      const options = {
        type: 'warning' as const,
        buttons: ['Save', "Don't Save", 'Cancel'],
        defaultId: 0,
        cancelId: 2,
        message: `Save the changes to “${planName}” before closing?`,
        detail: 'Without saving, the changes are lost.',
      };
      const win = parent();
      const { response } = win
        ? await dialog.showMessageBox(win, options)
        : await dialog.showMessageBox(options);
      return (['save', 'discard', 'cancel'] as const)[response] ?? 'cancel';
    },
    async askChangedOnDisk(fileName): Promise<ChangedOnDiskChoice> {
      const options = {
        type: 'warning' as const,
        buttons: ['Save As…', 'Overwrite', 'Reload from Disk', 'Cancel'],
        defaultId: 0,
        cancelId: 3,
        message: `“${fileName}” was changed by another program since you opened it.`,
        detail:
          'Save As keeps both versions. Overwrite replaces it (its current content is kept ' +
          'as the newest backup, “.bak”). Reload shows the file as it is now and drops ' +
          'your unsaved changes.',
      };
      const win = parent();
      const { response } = win
        ? await dialog.showMessageBox(win, options)
        : await dialog.showMessageBox(options);
      return CHANGED_ON_DISK_CHOICES[response] ?? 'cancel';
    },
  };
}

export async function showAbout(win: BrowserWindow | null): Promise<void> {
  const options = {
    type: 'info' as const,
    title: 'About Legwise',
    message: `Legwise ${app.getVersion()}`,
    detail:
      'Offline mission range and endurance planner for fixed-wing UAVs and light aircraft.\n\n' +
      'Estimates for planning only: the aircraft’s approved documents, local regulations ' +
      'and licensed practice govern.',
  };
  if (win) await dialog.showMessageBox(win, options);
  else await dialog.showMessageBox(options);
}
