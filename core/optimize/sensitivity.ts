/**
 * One-at-a-time sensitivity of the landing reserve margin (fuel or usable energy left
 * minus the reserve the policy requires) to the main inputs: each is moved by −5 % and
 * +5 % (the ISA offset by ∓5 K instead) and the whole plan is solved again (local
 * one-factor-at-a-time screening, Saltelli et al., Global Sensitivity Analysis: The Primer,
 * ch. 1 — from memory). Inputs whose change would leave the plan schema's limits are left
 * out rather than clamped.
 */
import { withMissionWind } from '../solver/missionWind.ts';
import type { Plan } from '../plan/schema.ts';
import { PlanSchema } from '../plan/schema.ts';
import { clonePlan, reserveMargin, solveForSearch } from './planTools.ts';

export interface SensitivityEntry {
  /** Dotted path of the input in the plan (`legs.*` for all legs). */
  input: string;
  label: string;
  /** Change of the reserve margin (kg of fuel or J of usable energy) for the lower value. */
  minus: number;
  /** Change for the higher value. */
  plus: number;
}

const RELATIVE_STEP = 0.05;
const ISA_STEP_K = 5;

interface Perturbation {
  input: string;
  label: string;
  /** Moves the input of the copy `p` down (s = −1) or up (s = +1). */
  apply: (p: Plan, s: -1 | 1) => void;
}

const scale = (s: -1 | 1) => 1 + s * RELATIVE_STEP;

/** Keys of T whose values are numbers. */
type NumberKeys<T> = { [K in keyof T]-?: T[K] extends number ? K : never }[keyof T] & string;

/** ±5 % of the number `key` of the object `select` finds in the copy (null: not this plan's kind). */
function scaled<T extends object>(
  input: string,
  label: string,
  select: (p: Plan) => T | null,
  key: NumberKeys<T>,
): Perturbation {
  return {
    input,
    label,
    apply: (p, s) => {
      const o = select(p) as Record<string, unknown> | null;
      const v = o?.[key];
      if (o && typeof v === 'number') o[key] = v * scale(s);
    },
  };
}

const polarOf = (p: Plan) => p.aircraft.polar;
const massOf = (p: Plan) => p.aircraft.mass;
const jetOf = (p: Plan) => (p.aircraft.powerplant.type === 'jet' ? p.aircraft.powerplant : null);
const propOf = (p: Plan) =>
  p.aircraft.powerplant.type === 'propeller' ? p.aircraft.powerplant : null;
const electricOf = (p: Plan) =>
  p.aircraft.powerplant.type === 'electric' ? p.aircraft.powerplant : null;

/** The inputs that apply to this plan's polar, powerplant and legs. */
function perturbations(plan: Plan): Perturbation[] {
  const pp = 'aircraft.powerplant';
  const list: Perturbation[] = [
    scaled('aircraft.polar.CD0', 'Zero-lift drag coefficient CD0', polarOf, 'CD0'),
    plan.aircraft.polar.induced.by === 'geometry'
      ? scaled(
          'aircraft.polar.induced.e',
          'Oswald efficiency e',
          (p) => (p.aircraft.polar.induced.by === 'geometry' ? p.aircraft.polar.induced : null),
          'e',
        )
      : scaled(
          'aircraft.polar.induced.k',
          'Induced-drag factor k',
          (p) => (p.aircraft.polar.induced.by === 'factor' ? p.aircraft.polar.induced : null),
          'k',
        ),
    scaled('aircraft.wingArea_m2', 'Wing area', (p) => p.aircraft, 'wingArea_m2'),
    scaled('aircraft.mass.empty_kg', 'Empty mass', massOf, 'empty_kg'),
  ];
  if (plan.aircraft.mass.payload_kg > 0) {
    list.push(scaled('aircraft.mass.payload_kg', 'Payload', massOf, 'payload_kg'));
  }
  switch (plan.aircraft.powerplant.type) {
    case 'jet':
      list.push(
        scaled(`${pp}.fuel.load_kg`, 'Fuel load', (p) => jetOf(p)?.fuel ?? null, 'load_kg'),
        scaled(`${pp}.tsfc_kg_Ns`, 'TSFC', jetOf, 'tsfc_kg_Ns'),
        scaled(`${pp}.maxThrustSL_N`, 'Maximum thrust', jetOf, 'maxThrustSL_N'),
      );
      break;
    case 'propeller':
      list.push(
        scaled(`${pp}.fuel.load_kg`, 'Fuel load', (p) => propOf(p)?.fuel ?? null, 'load_kg'),
        scaled(`${pp}.bsfc_kg_J`, 'BSFC', propOf, 'bsfc_kg_J'),
        scaled(`${pp}.propEfficiency`, 'Propeller efficiency', propOf, 'propEfficiency'),
        scaled(`${pp}.maxPowerSL_W`, 'Maximum power', propOf, 'maxPowerSL_W'),
      );
      break;
    case 'electric':
      list.push(
        scaled(
          `${pp}.battery.energy_J`,
          'Battery energy',
          (p) => electricOf(p)?.battery ?? null,
          'energy_J',
        ),
        scaled(`${pp}.motorEfficiency`, 'Motor efficiency', electricOf, 'motorEfficiency'),
        scaled(
          `${pp}.controllerEfficiency`,
          'Controller efficiency',
          electricOf,
          'controllerEfficiency',
        ),
        scaled(`${pp}.propEfficiency`, 'Propeller efficiency', electricOf, 'propEfficiency'),
        scaled(`${pp}.maxShaftPower_W`, 'Maximum shaft power', electricOf, 'maxShaftPower_W'),
      );
      break;
  }
  const windy = plan.legs.some(
    (l) => 'wind' in l && l.windSource !== 'aloft' && l.wind.speed_m_s > 0,
  );
  if (windy) {
    list.push({
      input: 'legs.*.wind.speed_m_s',
      label: 'Wind speeds',
      apply: (p, s) => {
        for (const l of p.legs) if ('wind' in l) l.wind.speed_m_s *= scale(s);
      },
    });
  }
  const aloftLegs = plan.legs.some((l) => 'windSource' in l && l.windSource === 'aloft');
  if (aloftLegs && plan.environment.windsAloft?.some((w) => w.speed_m_s > 0)) {
    list.push({
      input: 'environment.windsAloft.*.speed_m_s',
      label: 'Winds-aloft speeds',
      apply: (p, s) => {
        for (const w of p.environment.windsAloft ?? []) w.speed_m_s *= scale(s);
      },
    });
  }
  list.push({
    input: 'environment.isaOffset_K',
    label: 'ISA temperature offset (±5 K)',
    apply: (p, s) => (p.environment.isaOffset_K += s * ISA_STEP_K),
  });
  return list;
}

/**
 * Reserve-margin changes for ±5 % of each main input, largest effect first. Units follow
 * the plan's consumable: kg of fuel, or J of usable battery energy.
 */
export function reserveSensitivity(asGiven: Plan): SensitivityEntry[] {
  // The mission wind made explicit per leg, so that scaling the leg winds scales it too.
  const plan = withMissionWind(asGiven);
  const base = reserveMargin(solveForSearch(plan));
  const entries: SensitivityEntry[] = [];
  for (const pert of perturbations(plan)) {
    const variants = ([-1, 1] as const).map((s) => {
      const copy = clonePlan(plan);
      pert.apply(copy, s);
      return copy;
    });
    if (!variants.every((v) => PlanSchema.safeParse(v).success)) continue;
    const [minus, plus] = variants.map((v) => reserveMargin(solveForSearch(v)) - base) as [
      number,
      number,
    ];
    entries.push({ input: pert.input, label: pert.label, minus, plus });
  }
  const size = (e: SensitivityEntry) => Math.max(Math.abs(e.minus), Math.abs(e.plus));
  return entries.sort((a, b) => size(b) - size(a));
}
