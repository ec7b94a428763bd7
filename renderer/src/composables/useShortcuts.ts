/**
 * Undo and redo from the keyboard anywhere on the screen. They act on the plan even
 * inside a box, because the box text follows the plan.
 */
import { onBeforeUnmount, onMounted } from 'vue';
import type { PlanStore } from './usePlan.ts';
import { historyActionFor } from '../support/shortcuts.ts';

export function useShortcuts(plan: PlanStore): void {
  const onKey = (e: KeyboardEvent) => {
    const action = historyActionFor(e);
    if (!action) return;
    e.preventDefault();
    if (action === 'undo') plan.undo();
    else plan.redo();
  };
  onMounted(() => window.addEventListener('keydown', onKey));
  onBeforeUnmount(() => window.removeEventListener('keydown', onKey));
}
