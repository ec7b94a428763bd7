/**
 * The plan being edited, its check, and every edit operation. Edits are immutable
 * snapshots kept by `useHistory`; the draft may hold values the plan check refuses (NaN
 * for text that is not a number), in which case `lastValid` keeps the last plan that
 * passed and the result built from it is marked stale.
 */
import {
  computed,
  inject,
  ref,
  shallowRef,
  type ComputedRef,
  type InjectionKey,
  type Ref,
} from 'vue';
import type { Leg, LegKind, Plan } from '../../../core/plan/schema.ts';
import { parsePlan, type LoadResult } from '../../../core/plan/load.ts';
import type { PlanIssue } from '../../../core/plan/issues.ts';
import { defaultLeg } from '../../../core/plan/defaults.ts';
import { useHistory, type History } from './useHistory.ts';
import { aircraftSections, missionSections } from '../support/aircraftFields.ts';
import { adaptLegs, legFields } from '../support/legFields.ts';
import {
  num,
  parentPath,
  type ChoiceFieldDef,
  type FieldDef,
  type OptionalBlock,
} from '../support/fieldTypes.ts';
import { assignIssues, type FieldIssues } from '../support/issues.ts';
import { getAtPath, setAtPath } from '../support/paths.ts';
import * as legOps from '../support/legOps.ts';
import { airfieldSections, fieldDataSection } from '../support/airfieldFields.ts';
import { windLevelFields, waypointFields } from '../support/tableFields.ts';
import { uncertaintyFields } from '../support/confidenceFields.ts';
import { routeDistanceLegs } from '../support/routeOps.ts';

export interface PlanStore {
  readonly history: History<Plan>;
  /** The plan as edited; may hold refused values. */
  readonly draft: Readonly<Ref<Plan>>;
  readonly check: ComputedRef<LoadResult>;
  readonly valid: ComputedRef<boolean>;
  /** The last draft that passed the check, as the loader returned it. */
  readonly lastValid: ComputedRef<Plan>;
  readonly warnings: ComputedRef<string[]>;
  readonly issues: ComputedRef<PlanIssue[]>;
  readonly fieldIssues: ComputedRef<FieldIssues>;
  /** Leg whose fields are open in the editor. */
  readonly selectedLegId: Ref<string | null>;
  readonly selectedLegIndex: ComputedRef<number>;
  /** Changed since it was opened, created or saved. */
  readonly dirty: ComputedRef<boolean>;
  /** Writes one value; inside an absent optional `block`, the block is created first. */
  setValue(path: string, value: unknown, group?: string, block?: OptionalBlock): void;
  setChoice(def: ChoiceFieldDef, value: string): void;
  addLeg(kind: LegKind, at?: number): void;
  duplicateLeg(index: number): void;
  moveLeg(from: number, to: number): void;
  deleteLeg(index: number): void;
  /** One undoable edit that replaces the whole plan (an optimizer's suggestion). */
  edit(plan: Plan): void;
  /**
   * Replaces the whole plan (open, new, demo, restore). Undoable unless `fresh`; counts as
   * saved unless `unsaved` (a plan restored from an autosave was never saved).
   */
  load(plan: Plan, options?: { fresh?: boolean; unsaved?: boolean }): void;
  markSaved(): void;
  undo(): void;
  redo(): void;
  /** Ends the current typing group (field lost focus). */
  seal(): void;
}

/** All field paths on screen for a plan: aircraft sheet, conditions and every leg. */
export function allFields(plan: Plan): FieldDef[] {
  const sections = [
    ...aircraftSections(plan),
    fieldDataSection(plan),
    ...missionSections(plan),
    ...airfieldSections(plan),
  ];
  const waypoints = plan.route?.waypoints ?? [];
  const fromRoute = routeDistanceLegs(plan);
  return [
    { type: 'text', path: 'name', label: 'Plan name', maxLength: 120 },
    ...sections.flatMap((s) => s.fields),
    ...plan.legs.flatMap((leg, i) =>
      legFields(
        leg,
        i,
        plan.aircraft.powerplant.type === 'electric',
        waypoints,
        fromRoute.has(i),
        plan.environment.missionWind !== undefined,
      ),
    ),
    ...(plan.route
      ? [
          num('route.magneticVariation_deg', 'Magnetic variation', 'angle', 'deg'),
          ...waypoints.flatMap((_, i) => waypointFields(i)),
        ]
      : []),
    ...(plan.environment.windsAloft ?? []).flatMap((_, i) => windLevelFields(i)),
    ...uncertaintyFields(plan),
  ];
}

export function createPlanStore(initial: Plan, options: { historyLimit?: number } = {}): PlanStore {
  const history = useHistory<Plan>(initial, { limit: options.historyLimit ?? 200 });
  const draft = history.present;
  const check = computed(() => parsePlan(draft.value));
  const valid = computed(() => check.value.ok);

  const first = parsePlan(initial);
  let lastGood: Plan = first.ok ? first.plan : initial;
  const lastValid = computed(() => {
    const c = check.value;
    if (c.ok) lastGood = c.plan;
    return lastGood;
  });
  const warnings = computed(() => (check.value.ok ? check.value.warnings : []));
  const issues = computed(() => (check.value.ok ? [] : check.value.issues));
  const noIssues: FieldIssues = { byField: new Map(), general: [] };
  const fieldIssues = computed(() =>
    issues.value.length === 0
      ? noIssues
      : assignIssues(
          issues.value,
          allFields(draft.value).map((f) => f.path),
        ),
  );

  const selectedLegId = ref<string | null>(initial.legs[0]?.id ?? null);
  const selectedLegIndex = computed(() =>
    draft.value.legs.findIndex((l) => l.id === selectedLegId.value),
  );
  const saved = shallowRef<Plan>(initial);
  const dirty = computed(() => draft.value !== saved.value);

  const commitLegs = (legs: Leg[], group?: string) =>
    history.commit({ ...draft.value, legs }, group);

  function setValue(path: string, value: unknown, group?: string, block?: OptionalBlock): void {
    if (getAtPath(draft.value, path) === value) return;
    const base =
      block && getAtPath(draft.value, block.path) === undefined
        ? setAtPath(draft.value, block.path, block.create(draft.value))
        : draft.value;
    history.commit(setAtPath(base, path, value), group);
  }

  function setChoice(def: ChoiceFieldDef, value: string): void {
    if (String(getAtPath(draft.value, def.path) ?? def.fallback ?? '') === value) return;
    history.seal();
    const parent = parentPath(def.path);
    let next = def.apply
      ? def.apply(draft.value, value)
      : def.variant
        ? setAtPath(draft.value, parent, def.variant(value, getAtPath(draft.value, parent)))
        : setAtPath(draft.value, def.path, value);
    if (def.path === 'aircraft.powerplant.type') {
      next = { ...next, legs: adaptLegs(next.legs, value === 'electric') };
    }
    history.commit(next);
  }

  function addLeg(kind: LegKind, at?: number): void {
    const { legs, id } = legOps.addLeg(draft.value.legs, kind, defaultLeg, at);
    commitLegs(legs);
    selectedLegId.value = id;
  }

  function duplicateLeg(index: number): void {
    const { legs, id } = legOps.duplicateLeg(draft.value.legs, index);
    commitLegs(legs);
    selectedLegId.value = id;
  }

  function moveLeg(from: number, to: number): void {
    const legs = legOps.moveLeg(draft.value.legs, from, to);
    if (legs.every((l, i) => l === draft.value.legs[i])) return;
    commitLegs(legs);
  }

  function deleteLeg(index: number): void {
    const before = draft.value.legs;
    const legs = legOps.deleteLeg(before, index);
    if (legs.length === before.length) return;
    commitLegs(legs);
    if (before[index]?.id === selectedLegId.value) {
      selectedLegId.value = (legs[Math.min(index, legs.length - 1)] ?? null)?.id ?? null;
    }
  }

  function load(plan: Plan, opts: { fresh?: boolean; unsaved?: boolean } = {}): void {
    if (opts.fresh) history.reset(plan);
    else {
      history.seal();
      history.commit(plan);
    }
    if (!opts.unsaved) saved.value = plan;
    selectedLegId.value = plan.legs[0]?.id ?? null;
  }

  const keepSelection = () => {
    if (selectedLegIndex.value < 0) selectedLegId.value = draft.value.legs[0]?.id ?? null;
  };

  return {
    history,
    draft,
    check,
    valid,
    lastValid,
    warnings,
    issues,
    fieldIssues,
    selectedLegId,
    selectedLegIndex,
    dirty,
    setValue,
    setChoice,
    addLeg,
    duplicateLeg,
    moveLeg,
    deleteLeg,
    load,
    edit: (p: Plan) => {
      history.seal();
      history.commit(p);
      keepSelection();
    },
    markSaved: () => {
      saved.value = draft.value;
    },
    undo: () => {
      history.undo();
      keepSelection();
    },
    redo: () => {
      history.redo();
      keepSelection();
    },
    seal: () => history.seal(),
  };
}

export const PLAN_KEY: InjectionKey<PlanStore> = Symbol('plan');

/** The plan store the app provided. */
export function usePlan(): PlanStore {
  const store = inject(PLAN_KEY);
  if (!store) throw new Error('usePlan() needs the plan store provided by the app');
  return store;
}
