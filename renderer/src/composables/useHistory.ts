/**
 * Undo and redo over immutable snapshots. Consecutive commits that carry the same
 * `group` (for example every keystroke in one field) fold into a single step, so one
 * undo takes the whole edit back; `seal()` ends the group (the field lost focus).
 */
import { computed, shallowRef, type ComputedRef, type Ref } from 'vue';

export interface History<T> {
  /** The present state. Treat as read-only; change it through `commit`. */
  readonly present: Readonly<Ref<T>>;
  readonly canUndo: ComputedRef<boolean>;
  readonly canRedo: ComputedRef<boolean>;
  /** Steps available in each direction (for button titles and tests). */
  readonly depth: ComputedRef<{ undo: number; redo: number }>;
  commit(next: T, group?: string): void;
  undo(): boolean;
  redo(): boolean;
  /** Ends the current edit group: the next commit becomes a new step. */
  seal(): void;
  /** Starts over from `state` with no steps to undo or redo. */
  reset(state: T): void;
}

export interface HistoryOptions {
  /** Oldest steps are dropped beyond this many (at least 1). */
  limit?: number;
}

export function useHistory<T>(initial: T, options: HistoryOptions = {}): History<T> {
  const limit = Math.max(1, Math.floor(options.limit ?? 200));
  const present = shallowRef(initial) as Ref<T>;
  const past = shallowRef<T[]>([]);
  const future = shallowRef<T[]>([]);
  let openGroup: string | null = null;

  function commit(next: T, group?: string): void {
    if (group !== undefined && group === openGroup && past.value.length > 0) {
      present.value = next;
    } else {
      const kept = [...past.value, present.value];
      past.value = kept.length > limit ? kept.slice(kept.length - limit) : kept;
      present.value = next;
    }
    future.value = [];
    openGroup = group ?? null;
  }

  function undo(): boolean {
    const previous = past.value[past.value.length - 1];
    if (past.value.length === 0) return false;
    future.value = [present.value, ...future.value];
    past.value = past.value.slice(0, -1);
    present.value = previous as T;
    openGroup = null;
    return true;
  }

  function redo(): boolean {
    const [next, ...rest] = future.value;
    if (future.value.length === 0) return false;
    past.value = [...past.value, present.value];
    future.value = rest;
    present.value = next as T;
    openGroup = null;
    return true;
  }

  function reset(state: T): void {
    past.value = [];
    future.value = [];
    present.value = state;
    openGroup = null;
  }

  return {
    present,
    canUndo: computed(() => past.value.length > 0),
    canRedo: computed(() => future.value.length > 0),
    depth: computed(() => ({ undo: past.value.length, redo: future.value.length })),
    commit,
    undo,
    redo,
    seal: () => {
      openGroup = null;
    },
    reset,
  };
}
