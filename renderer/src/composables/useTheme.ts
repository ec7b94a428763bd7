/**
 * High-contrast theme for reading the screen in bright daylight at an airfield: black on
 * white, heavier lines, no greys for meaning. Remembered between sessions.
 */
import { ref, watch, type Ref } from 'vue';
import { readSetting, writeSetting } from '../support/settingsStore.ts';

export interface Theme {
  highContrast: Ref<boolean>;
  toggle(): void;
}

let theme: Theme | null = null;

export function useTheme(): Theme {
  if (theme) return theme;
  const highContrast = ref(readSetting('theme') === 'contrast');
  const apply = () => {
    document.documentElement.dataset.theme = highContrast.value ? 'contrast' : 'normal';
    writeSetting('theme', highContrast.value ? 'contrast' : 'normal');
  };
  watch(highContrast, apply, { immediate: true });
  theme = { highContrast, toggle: () => (highContrast.value = !highContrast.value) };
  return theme;
}
