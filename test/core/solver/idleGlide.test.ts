/**
 * A glide at idle is consistent (core/solver/idleThrust.ts): the idle fuel flow the solver
 * charges comes with the idle thrust it implies, and the sink falls by that thrust power.
 * Hand evaluation at sea level (ρ 1.22500 kg/m³, 1976 standard, shared/REFERENCES.md), where
 * the (L/D)max speed gives D·V = W·V/(L/D)max with (L/D)max = 1/(2√(k·CD0)) (Anderson,
 * Introduction to Flight, ch. 6), so the sink with idle thrust over the sink without is
 * 1 − P_idle/(D·V) (the acceleration factor k_a of the schedule cancels in the ratio).
 */
import { describe, expect, it } from 'vitest';
import { buildModel } from '../../../core/solver/model.ts';
import { evaluatePoint, newPoint, type FlightPath } from '../../../core/solver/point.ts';
import { solvePlan } from '../../../core/solver/solve.ts';
import { G0 } from '../../../core/units.ts';
import {
  ANDERSON_JET,
  ANDERSON_PROP,
  descent,
  jetPowerplant,
  makePlan,
  propPowerplant,
  rel,
  type Kind,
} from './fixtures.ts';

const GLIDE: FlightPath = {
  speed: { kind: 'bestGlide' },
  vertical: { kind: 'glide' },
  headwind_m_s: 0,
  crosswind_m_s: 0,
  field: 'test',
};

function glidePoint(kind: Kind, idle: number, mass_kg: number) {
  const powerplant =
    kind === 'jet'
      ? jetPowerplant({ idleFuelFraction: idle })
      : propPowerplant({ idlePowerFraction: idle });
  const plan = makePlan(kind, [descent({ toAltitude_m: 0 })], { powerplant, departure_m: 500 });
  const model = buildModel(plan);
  return evaluatePoint(model, GLIDE, mass_kg, 0, {}, newPoint(model, 0));
}

describe('glide at idle with the idle thrust its fuel flow implies', () => {
  it('propeller: idle shaft power f·P_max gives thrust power η·f·P_max', () => {
    const m = ANDERSON_PROP.W0_N / G0;
    const { S, span, CD0, e, eta, maxPower_W } = ANDERSON_PROP;
    const k = 1 / (Math.PI * e * ((span * span) / S));
    const LDmax = 1 / (2 * Math.sqrt(k * CD0));
    const CL = Math.sqrt(CD0 / k);
    const V = Math.sqrt((2 * m * G0) / (1.225 * S * CL));
    const DV = (m * G0 * V) / LDmax;
    const idle = 0.05;
    const withIdle = glidePoint('propeller', idle, m);
    const without = glidePoint('propeller', 0, m);
    expect(rel(withIdle.tas_m_s, V)).toBeLessThan(1e-5);
    // Gagg–Ferrar at σ = 1 gives P_SL: thrust power at idle η·f·P_SL (hand).
    const ratio = 1 - (eta * idle * maxPower_W) / DV;
    expect(ratio).toBeLessThan(1);
    expect(rel(withIdle.climb_m_s / without.climb_m_s, ratio)).toBeLessThan(1e-5);
    // The fuel charged is the idle flow BSFC·f·P_SL (the same idle setting).
    expect(rel(withIdle.rate, ANDERSON_PROP.bsfc_kg_J * idle * maxPower_W)).toBeLessThan(1e-9);
  });

  it('jet: idle flow TSFC·f·T_SL is the flow of the thrust f·T_SL', () => {
    const m = ANDERSON_JET.W0_N / G0;
    const { S, span, CD0, e } = ANDERSON_JET;
    const k = 1 / (Math.PI * e * ((span * span) / S));
    const LDmax = 1 / (2 * Math.sqrt(k * CD0));
    const idle = 0.08;
    const T_SL = 40_000; // the fixture's sea-level maximum thrust
    const withIdle = glidePoint('jet', idle, m);
    const without = glidePoint('jet', 0, m);
    // D·V = W·V/(L/D)max and P_idle = f·T_SL·V: the ratio is 1 − f·T_SL·(L/D)max/W (hand).
    const ratio = 1 - (idle * T_SL * LDmax) / (m * G0);
    expect(rel(withIdle.climb_m_s / without.climb_m_s, ratio)).toBeLessThan(1e-5);
  });

  it('an idle thrust that balances the drag cannot glide down, and says so', () => {
    const plan = makePlan('jet', [descent({ toAltitude_m: 0 })], {
      powerplant: jetPowerplant({ idleFuelFraction: 0.5 }),
      departure_m: 1000,
    });
    const r = solvePlan(plan);
    expect(r.legs[0]!.status).toBe('failed');
    expect(r.legs[0]!.error).toContain('cannot glide down at idle');
  });
});
