/**
 * Small screen preferences (unit system, theme) and the browser autosave in localStorage.
 * Storage can be missing or refuse writes (private windows, file:// in some shells); the
 * screen then simply does not remember.
 */
const PREFIX = 'legwise.';

function storage(): Storage | null {
  try {
    return typeof localStorage === 'undefined' ? null : localStorage;
  } catch {
    return null;
  }
}

export function readSetting(key: string): string | null {
  try {
    return storage()?.getItem(PREFIX + key) ?? null;
  } catch {
    return null;
  }
}

export function writeSetting(key: string, value: string | null): void {
  try {
    const s = storage();
    if (!s) return;
    if (value === null) s.removeItem(PREFIX + key);
    else s.setItem(PREFIX + key, value);
  } catch {
    // Quota or privacy settings: not remembering is acceptable.
  }
}
