/** Injection of the file actions created by App.vue. */
import { inject, type InjectionKey } from 'vue';
import type { FileActions } from './useFiles.ts';

export const FILES_KEY: InjectionKey<FileActions> = Symbol('files');

export function useFileActions(): FileActions {
  const files = inject(FILES_KEY);
  if (!files) throw new Error('useFileActions() needs the file actions provided by the app');
  return files;
}
