/**
 * The screen's theme. Three looks: the everyday one ('normal'), high contrast for bright
 * daylight at an airfield (black on white, heavier lines, no greys for meaning) and night
 * (dim, warm, low in blue, for operations in the dark). Unless the person picks one, the
 * screen follows the system's light/dark preference (CSS `prefers-color-scheme`).
 * The choice is remembered between sessions.
 */
import { computed, ref, watch, type ComputedRef, type Ref } from 'vue';
import { readSetting, writeSetting } from '../support/settingsStore.ts';

/** What the person chose; 'auto' follows the system. */
export type ThemeChoice = 'auto' | 'day' | 'contrast' | 'night';
/** What the screen shows (the `data-theme` attribute). */
export type AppliedTheme = 'normal' | 'contrast' | 'night';

export interface Theme {
  choice: Ref<ThemeChoice>;
  applied: ComputedRef<AppliedTheme>;
  highContrast: ComputedRef<boolean>;
  night: ComputedRef<boolean>;
  /** The Contrast button: on, or back to following the system. */
  toggle(): void;
  /** The Night button: on, or off (day, or following the system when that is light). */
  toggleNight(): void;
}

/** A stored value → a choice; 'normal' (what earlier versions wrote) meant no choice. */
export function themeChoiceOf(stored: string | null): ThemeChoice {
  return stored === 'day' || stored === 'contrast' || stored === 'night' ? stored : 'auto';
}

export function appliedTheme(choice: ThemeChoice, systemDark: boolean): AppliedTheme {
  if (choice === 'contrast') return 'contrast';
  if (choice === 'night') return 'night';
  if (choice === 'day') return 'normal';
  return systemDark ? 'night' : 'normal';
}

let theme: Theme | null = null;

export function useTheme(): Theme {
  if (theme) return theme;
  const choice = ref<ThemeChoice>(themeChoiceOf(readSetting('theme')));
  const query =
    typeof window.matchMedia === 'function'
      ? window.matchMedia('(prefers-color-scheme: dark)')
      : null;
  const systemDark = ref(query?.matches ?? false);
  query?.addEventListener('change', (e) => (systemDark.value = e.matches));
  const applied = computed(() => appliedTheme(choice.value, systemDark.value));
  watch(
    applied,
    (value) => {
      document.documentElement.dataset.theme = value;
    },
    { immediate: true },
  );
  watch(choice, (value) => writeSetting('theme', value));
  const night = computed(() => applied.value === 'night');
  theme = {
    choice,
    applied,
    highContrast: computed(() => applied.value === 'contrast'),
    night,
    toggle: () => (choice.value = applied.value === 'contrast' ? 'auto' : 'contrast'),
    toggleNight: () => {
      if (!night.value) choice.value = 'night';
      else choice.value = systemDark.value ? 'day' : 'auto';
    },
  };
  return theme;
}
