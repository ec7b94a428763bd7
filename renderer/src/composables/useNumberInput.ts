/**
 * One number box bound to a plan path. Input integrity rules (issue 11, DEVELOPERS.md):
 * - the text is the person's: it is never rewritten while it stands for the stored value
 *   (only undo, a unit or locale switch, or an edit elsewhere that changes the value
 *   refreshes it, and then with the text they typed for that value when there is one);
 * - every keystroke goes to the plan at once: text that reads as a number by the locale's
 *   rule (renderer/src/support/numberText.ts) is converted with the exact factors at full
 *   precision; text that does not becomes NaN, so the plan check names the field, the
 *   result goes stale and nothing is saved — the text and its message stay until fixed;
 * - validity and how ambiguous text was read are shown beside the box, never by opening,
 *   closing or moving anything.
 * Shared by the labelled field and the table cell.
 */
import { computed, ref, watch, type ComputedRef, type Ref } from 'vue';
import { usePlan } from './usePlan.ts';
import { useUnits } from './useUnits.ts';
import { fieldId, type NumberFieldDef } from '../support/fieldTypes.ts';
import {
  editableText,
  flightLevelBoxText,
  parseNumberText,
  storedFromText,
  textShowsValue,
} from '../support/fieldBinding.ts';
import {
  referencedLabel,
  referenceOf,
  referenceOffset_m,
  shownHeight_m,
} from '../support/heightReference.ts';
import { limitInUnit } from '../support/issues.ts';
import { getAtPath, splitPath } from '../support/paths.ts';
import { typedTexts } from '../support/typedText.ts';

export interface NumberInput {
  id: ComputedRef<string>;
  text: Ref<string>;
  unitLabel: ComputedRef<string>;
  message: ComputedRef<string | null>;
  /** How the text was read when another locale would read it differently. */
  note: ComputedRef<string | null>;
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
  // Route and leg altitudes may be shown above the departure field (heightReference.ts).
  const reference = computed(() => {
    const d = def();
    return d.datum ? referenceOf(d.datum, units.altitudeReference.value) : null;
  });
  const offset_m = computed(() =>
    reference.value && def().stored === 'm'
      ? referenceOffset_m(reference.value, plan.draft.value.environment.departureElevation_m)
      : 0,
  );
  const unitLabel = computed(() => {
    const q = def().quantity;
    if (!q) return '';
    const label = units.unitLabel(q);
    return reference.value ? referencedLabel(label, reference.value) : label;
  });
  const reading = computed(() =>
    units.reading(def().quantity ?? null, plan.draft.value.environment.qnh_Pa),
  );
  const textFor = (v: number | undefined) => {
    const d = def();
    if (v === undefined) return '';
    // Typed texts are remembered by the value shown (above the reference), so a text typed
    // as a height comes back only while the same height is shown.
    const shown = shownHeight_m(v, offset_m.value);
    const typed = typedTexts.lookup(d.path, shown, shownUnit.value, reading.value.style.locale);
    if (typed !== undefined) return typed;
    const rule = reading.value.flightLevels;
    const level = rule ? flightLevelBoxText(v, d.stored, rule) : null;
    if (level !== null) return level;
    return editableText(
      shown,
      d.stored,
      shownUnit.value,
      d.quantity ?? d.digits ?? null,
      reading.value.style,
    );
  };
  const text = ref(textFor(stored.value));

  // Refresh the box only when the plan changed underneath it (undo, unit or locale switch, a
  // suggestion applied), never while it still stands for the value — the person's own text stays.
  watch([stored, shownUnit, reading, offset_m], () => {
    const v = stored.value;
    // While the departure elevation is being typed (not yet a number) the box waits.
    if (!Number.isFinite(offset_m.value)) return;
    const same =
      v === undefined
        ? text.value.trim() === ''
        : textShowsValue(
            text.value,
            v,
            def().stored,
            shownUnit.value,
            reading.value,
            offset_m.value,
          );
    if (!same) text.value = textFor(v);
  });

  const parsed = computed(() =>
    def().optional && text.value.trim() === '' ? null : parseNumberText(text.value, reading.value),
  );
  const typingError = computed(() =>
    parsed.value && !parsed.value.ok ? parsed.value.message : null,
  );
  const note = computed(() =>
    parsed.value && parsed.value.ok ? (parsed.value.note ?? null) : null,
  );
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
        : storedFromText(text.value, shownUnit.value, d.stored, reading.value, offset_m.value);
    // Remembered when the box is left (the finished text, not every prefix on the way).
    pending =
      value === undefined
        ? null
        : {
            stored: shownHeight_m(value, offset_m.value),
            unit: shownUnit.value,
            locale: reading.value.style.locale,
            text: text.value,
          };
    plan.setValue(d.path, value, d.path, d.block);
  }

  let pending: Parameters<typeof typedTexts.remember>[1] | null = null;
  function seal(): void {
    if (pending) typedTexts.remember(def().path, pending);
    pending = null;
    plan.seal();
  }

  return { id, text, unitLabel, message, note, onInput, seal };
}
