/**
 * Preload for the sandboxed page: exposes `window.legwise`, a few task-named
 * functions each bound to one IPC channel. The page never sees `ipcRenderer`.
 * Sandboxed preloads run as CommonJS and may only require('electron'), so this file
 * imports values from `channels.ts` alone (types come from `contract.ts`).
 */
import { contextBridge, ipcRenderer, type IpcRendererEvent } from 'electron';
import {
  API_KEY,
  MENU_COMMAND_CHANNEL,
  channelOf,
  isMenuCommand,
  type InvokeMethod,
} from './channels.ts';
import type { InvokeResult, LegwiseApi, MenuCommand } from './contract.ts';

function invoke<K extends InvokeMethod>(method: K, ...args: unknown[]): Promise<InvokeResult<K>> {
  return ipcRenderer.invoke(channelOf(method), ...args) as Promise<InvokeResult<K>>;
}

const api: LegwiseApi = {
  newPlan: () => invoke('newPlan'),
  openPlan: () => invoke('openPlan'),
  openRecent: (filePath) => invoke('openRecent', filePath),
  savePlan: (plan) => invoke('savePlan', plan),
  savePlanAs: (plan) => invoke('savePlanAs', plan),
  listRecent: () => invoke('listRecent'),
  setDirty: (state) => invoke('setDirty', state),
  autosave: (plan) => invoke('autosave', plan),
  recoverAutosave: () => invoke('recoverAutosave'),
  discardAutosave: () => invoke('discardAutosave'),
  exportPdf: (options) => invoke('exportPdf', options),
  exportCsv: (options) => invoke('exportCsv', options),
  exportGpx: (options) => invoke('exportGpx', options),
  printReport: () => invoke('printReport'),
  openOffered: () => invoke('openOffered'),
  onMenuCommand(callback: (command: MenuCommand) => void) {
    // The page gets the command only, never the IPC event (it would expose the sender).
    const listener = (_event: IpcRendererEvent, command: unknown) => {
      if (isMenuCommand(command)) callback(command);
    };
    ipcRenderer.on(MENU_COMMAND_CHANNEL, listener);
    return () => {
      ipcRenderer.removeListener(MENU_COMMAND_CHANNEL, listener);
    };
  },
};

contextBridge.exposeInMainWorld(API_KEY, api);
