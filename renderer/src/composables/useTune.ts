/**
 * The optimizers, run when asked (each costs tens to hundreds of whole-mission solves).
 * A finding remembers the plan it was computed from; when the plan has changed since,
 * it is shown as out of date until run again.
 */
import { computed, inject, shallowRef, type ComputedRef, type InjectionKey, type Ref } from 'vue';
import type { Plan } from '../../../core/plan/schema.ts';
import { bestSpeedForLeg, type SpeedSweepResult } from '../../../core/optimize/speedSweep.ts';
import {
  bestCruiseAltitude,
  type AltitudeSweepResult,
} from '../../../core/optimize/altitudeSweep.ts';
import { maxPayload, type MaxPayloadResult } from '../../../core/optimize/maxPayload.ts';
import { reserveSensitivity, type SensitivityEntry } from '../../../core/optimize/sensitivity.ts';
import type { PlanStore } from './usePlan.ts';
import { roundSuggestion, withCruiseAltitude } from '../support/tuneApply.ts';
import type { LevelGrid } from '../../../core/levels.ts';

export type Finding<T> =
  { ok: true; value: T; plan: Plan; ms: number } | { ok: false; message: string; plan: Plan };

export interface SpeedFinding {
  legIndex: number;
  legId: string;
  sweep: SpeedSweepResult;
}

export interface Tune {
  speed: Ref<Finding<SpeedFinding> | null>;
  altitude: Ref<Finding<AltitudeSweepResult> | null>;
  payload: Ref<Finding<MaxPayloadResult> | null>;
  sensitivity: Ref<Finding<SensitivityEntry[]> | null>;
  /** Legs whose speed can be tuned (cruise and loiter). */
  tunableLegs: ComputedRef<{ index: number; id: string }[]>;
  isCurrent(f: Finding<unknown> | null): boolean;
  runSpeed(legIndex: number): void;
  runAltitude(): void;
  runPayload(): void;
  runSensitivity(): void;
  applySpeed(): void;
  applyAltitude(): void;
  applyPayload(): void;
}

function attempt<T>(plan: Plan, run: (p: Plan) => T): Finding<T> {
  const t0 = performance.now();
  try {
    return { ok: true, value: run(plan), plan, ms: performance.now() - t0 };
  } catch (err) {
    return { ok: false, message: err instanceof Error ? err.message : String(err), plan };
  }
}

/**
 * `levelGrid`: the levels the altitude suggestion snaps to (500 ft where feet are shown,
 * 100 m otherwise; core/levels.ts).
 */
export function createTune(
  store: PlanStore,
  levelGrid: () => LevelGrid = () => ({ step: 'm100' }),
): Tune {
  const speed = shallowRef<Finding<SpeedFinding> | null>(null);
  const altitude = shallowRef<Finding<AltitudeSweepResult> | null>(null);
  const payload = shallowRef<Finding<MaxPayloadResult> | null>(null);
  const sensitivity = shallowRef<Finding<SensitivityEntry[]> | null>(null);
  const plan = () => store.lastValid.value;

  return {
    speed,
    altitude,
    payload,
    sensitivity,
    tunableLegs: computed(() =>
      plan().legs.flatMap((l, index) =>
        l.kind === 'cruise' || l.kind === 'loiter' ? [{ index, id: l.id }] : [],
      ),
    ),
    isCurrent: (f) => f !== null && f.plan === plan() && store.valid.value,
    runSpeed: (legIndex) => {
      speed.value = attempt(plan(), (p) => ({
        legIndex,
        legId: p.legs[legIndex]?.id ?? '',
        sweep: bestSpeedForLeg(p, legIndex),
      }));
    },
    runAltitude: () =>
      (altitude.value = attempt(plan(), (p) => bestCruiseAltitude(p, { levels: levelGrid() }))),
    runPayload: () => (payload.value = attempt(plan(), (p) => maxPayload(p))),
    runSensitivity: () => (sensitivity.value = attempt(plan(), (p) => reserveSensitivity(p))),
    applySpeed: () => {
      const f = speed.value;
      if (!f?.ok) return;
      const index = store.draft.value.legs.findIndex((l) => l.id === f.value.legId);
      if (index < 0) return;
      const tas = roundSuggestion(f.value.sweep.best.tas_m_s, 0.1);
      store.seal();
      store.setValue(`legs.${index}.speed`, { kind: 'tas', speed_m_s: tas });
    },
    applyAltitude: () => {
      const found = altitude.value?.ok ? altitude.value.value : null;
      if (!found?.best) return;
      // The level people fly (exact: 6000 ft is 1828.8 m), else the optimum to 1 m.
      const h = found.level ? found.level.altitude_m : roundSuggestion(found.best.altitude_m, 1);
      store.edit(withCruiseAltitude(store.draft.value, h));
    },
    applyPayload: () => {
      const f = payload.value;
      if (!f?.ok || !f.value.feasible) return;
      // Round down so the suggestion stays inside the limit that was found.
      const kg = Math.floor(f.value.payload_kg * 10) / 10;
      store.seal();
      store.setValue('aircraft.mass.payload_kg', kg);
    },
  };
}

export const TUNE_KEY: InjectionKey<Tune> = Symbol('tune');

export function useTune(): Tune {
  const tune = inject(TUNE_KEY);
  if (!tune) throw new Error('useTune() needs the optimizers provided by the app');
  return tune;
}
