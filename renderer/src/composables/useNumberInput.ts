/**
 * One number box bound to a plan path: shows the stored value in the display unit, keeps the
 * person's own digits while they stand for the value, writes every keystroke (NaN for text
 * that is not a number, so the plan check names the field) and restates limits in the
 * unit shown. Shared by the labelled field and the table cell.
 */
import { computed, ref, watch, type ComputedRef, type Ref } from 'vue';
import { usePlan } from './usePlan.ts';
import { useUnits } from './useUnits.ts';
import { fieldId, type NumberFieldDef } from '../support/fieldTypes.ts';
import {
  editableText,
  parseNumberText,
  storedFromText,
  textShowsValue,
} from '../support/fieldBinding.ts';
import { limitInUnit } from '../support/issues.ts';
import { getAtPath, splitPath } from '../support/paths.ts';

export interface NumberInput {
  id: ComputedRef<string>;
  text: Ref<string>;
  unitLabel: ComputedRef<string>;
  message: ComputedRef<string | null>;
  onInput(event: Event): void;
  seal(): void;
}

export function useNumberInput(def: () => NumberFieldDef): NumberInput {
  const plan = usePlan();
  const units = useUnits();
  const id = computed(() => fieldId(def().path));
  const stored = computed(() => {
    const d = def();
    const value = getAtPath(plan.draft.value, d.path);
    if (value !== undefined || !d.block) return value as number | undefined;
    // An absent optional block shows the value it would be created with.
    if (getAtPath(plan.draft.value, d.block.path) !== undefined) return undefined;
    const inner = splitPath(d.path).slice(splitPath(d.block.path).length).join('.');
    return getAtPath(d.block.create(plan.draft.value), inner) as number | undefined;
  });
  const shownUnit = computed(() => {
    const d = def();
    return d.quantity ? units.unitFor(d.quantity) : d.stored;
  });
  const unitLabel = computed(() => {
    const q = def().quantity;
    return q ? units.unitLabel(q) : '';
  });
  const textFor = (v: number | undefined) => {
    const d = def();
    return v === undefined
      ? ''
      : editableText(v, d.stored, shownUnit.value, d.quantity ?? d.digits ?? null);
  };
  const text = ref(textFor(stored.value));

  // Refresh the box only when the plan changed underneath it (undo, unit switch, a suggestion
  // applied), never while it still stands for the value — the person's own digits stay.
  watch([stored, shownUnit], () => {
    const v = stored.value;
    const same =
      v === undefined
        ? text.value.trim() === ''
        : textShowsValue(text.value, v, def().stored, shownUnit.value);
    if (!same) text.value = textFor(v);
  });

  const typingError = computed(() => {
    if (def().optional && text.value.trim() === '') return null;
    const parsed = parseNumberText(text.value);
    return parsed.ok ? null : parsed.message;
  });
  const message = computed(() => {
    if (typingError.value) return typingError.value;
    const d = def();
    const m = plan.fieldIssues.value.byField.get(d.path);
    return m ? limitInUnit(m, d.stored, shownUnit.value) : null;
  });

  function onInput(event: Event): void {
    const d = def();
    text.value = (event.target as HTMLInputElement).value;
    const value =
      d.optional && text.value.trim() === ''
        ? undefined
        : storedFromText(text.value, shownUnit.value, d.stored);
    plan.setValue(d.path, value, d.path, d.block);
  }

  return { id, text, unitLabel, message, onInput, seal: () => plan.seal() };
}
