import { describe, expect, it } from 'vitest';
import { InputError } from '../../../core/errors.ts';
import { fieldAir } from '../../../core/field/air.ts';
import { runwayCheck } from '../../../core/field/check.ts';
import { launchCheck } from '../../../core/field/launch.ts';
import { SURFACES, surfaceFriction } from '../../../core/field/surfaces.ts';
import { staticThrustMomentum, thrustAt } from '../../../core/field/thrust.ts';
import { G0 } from '../../../core/units.ts';

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);

describe('runwayCheck', () => {
  it('computes margin = (available − factor·required)/available and its state (core/solver/types.ts semantics)', () => {
    // 600 m × 1.43 (landing factor, common practice) = 858 m against 1000 m: margin 0.142.
    const c = runwayCheck({ required_m: 600, available_m: 1000, factor: 1.43 });
    expect(rel(c.factored_m, 858)).toBeLessThan(1e-12);
    expect(rel(c.margin, 0.142)).toBeLessThan(1e-12);
    expect(c.state).toBe('ok');
    expect(runwayCheck({ required_m: 850, available_m: 1000, factor: 1.15 }).state).toBe('tight'); // margin 0.0225
    expect(runwayCheck({ required_m: 900, available_m: 1000, factor: 1.15 }).state).toBe('fails'); // margin −0.035
    expect(runwayCheck({ required_m: 800, available_m: 1000, tightMargin: 0.25 }).state).toBe(
      'tight',
    );
  });
  it('refuses a factor below 1 and a non-finite distance', () => {
    expect(() => runwayCheck({ required_m: 1, available_m: 100, factor: 0.9 })).toThrow(InputError);
    expect(() => runwayCheck({ required_m: Number.NaN, available_m: 100 })).toThrow(/required_m/);
  });
});

describe('launchCheck', () => {
  // Small UAV invented for the test: 4 kg, 0.6 m², CLmax 1.2, ρ = 1.225.
  const uav = { mass_kg: 4, wingArea_m2: 0.6, CLmax: 1.2, rho_kg_m3: 1.225 };
  const Vs = Math.sqrt((2 * 4 * G0) / (1.225 * 0.6 * 1.2)); // 9.43 m/s, V_s = √(2W/(ρSCLmax))

  it('hand launch: release airspeed = throw speed + headwind against 1.15·V_s (common practice)', () => {
    const r = launchCheck({ ...uav, launchSpeed_m_s: 8, headwind_m_s: 4 });
    expect(rel(r.stallSpeed_m_s, Vs)).toBeLessThan(1e-12);
    expect(rel(r.requiredAirspeed_m_s, 1.15 * Vs)).toBeLessThan(1e-12);
    expect(rel(r.margin, 12 / (1.15 * Vs) - 1)).toBeLessThan(1e-12);
    expect(r.state).toBe('ok');
    expect(launchCheck({ ...uav, launchSpeed_m_s: 8 }).state).toBe('fails');
  });

  it('catapult: mean acceleration V²/(2·stroke) and release speed from energy √(2ηE/m) (elementary mechanics)', () => {
    const r = launchCheck({ ...uav, catapult: { stroke_m: 2, energy_J: 500, efficiency: 0.5 } });
    const V = Math.sqrt((2 * 0.5 * 500) / 4); // 11.18 m/s
    expect(rel(r.releaseGroundSpeed_m_s, V)).toBeLessThan(1e-12);
    expect(rel(r.catapult?.meanAcceleration_m_s2 ?? 0, (V * V) / 4)).toBeLessThan(1e-12);
    expect(rel(r.catapult?.meanAcceleration_g ?? 0, (V * V) / 4 / G0)).toBeLessThan(1e-12);
    expect(rel(r.catapult?.requiredEnergy_J ?? 0, 0.5 * 4 * (1.15 * Vs) ** 2)).toBeLessThan(1e-12);
    expect(r.catapult?.deliveredEnergy_J).toBe(250);
  });

  it('needs a launch speed or a catapult energy, and names bad fields', () => {
    expect(() => launchCheck(uav)).toThrow(/launchSpeed_m_s/);
    expect(() => launchCheck({ ...uav, launchSpeed_m_s: 10, factor: 0.8 })).toThrow(/factor/);
    expect(() => launchCheck({ ...uav, launchSpeed_m_s: 10, catapult: { stroke_m: 0 } })).toThrow(
      /catapult.stroke_m/,
    );
  });
});

describe('surfaces, field air and thrust helpers', () => {
  it('tabulates rolling and braking friction (Raymer ch. 17, common practice, from memory)', () => {
    expect(SURFACES.dryHard.muRoll).toBeGreaterThanOrEqual(0.03); // Raymer: 0.03–0.05
    expect(SURFACES.dryHard.muRoll).toBeLessThanOrEqual(0.05);
    expect(SURFACES.wetHard.muBrake).toBeLessThan(SURFACES.dryHard.muBrake);
    for (const s of Object.values(SURFACES)) expect(s.muBrake).toBeGreaterThan(s.muRoll);
    expect(surfaceFriction({ muRoll: 0.06, muBrake: 0.3 })).toEqual({ muRoll: 0.06, muBrake: 0.3 });
    expect(() => surfaceFriction({ muRoll: 0.06, muBrake: 2 })).toThrow(/surface.muBrake/);
  });

  it('field air at sea level, standard QNH and 15 °C is the ISA sea-level state (1976 U.S. Standard Atmosphere)', () => {
    const a = fieldAir({ elevation_m: 0, temperature_K: 288.15 });
    expect(rel(a.atm.rho_kg_m3, 1.225)).toBeLessThan(1e-5);
    expect(Math.abs(a.isaOffset_K)).toBeLessThan(1e-9);
    // 1000 m, ISA+20: standard pressure 89 874.6 Pa (1976 standard table), ρ = p/(R·(281.65 + 20)).
    const hot = fieldAir({ elevation_m: 1000, isaOffset_K: 20 });
    expect(rel(hot.atm.rho_kg_m3, 89874.6 / (287.0531 * 301.65))).toBeLessThan(1e-5);
    expect(() => fieldAir({ elevation_m: 0, temperature_K: 290, isaOffset_K: 1 })).toThrow(
      /isaOffset_K/,
    );
    expect(() => fieldAir({ elevation_m: 9000 })).toThrow(/elevation_m/);
  });

  it('static thrust from momentum theory T = (2ρA)^(1/3)·(FM·P)^(2/3) (McCormick ch. 6, from memory)', () => {
    // 100 kW, 1.8 m, FM 0.6, ρ 1.225: A = 2.5447 m², 2ρA = 6.2345, (60 000)^(2/3) = 1532.6 → ≈ 2819 N.
    const T = staticThrustMomentum({
      shaftPower_W: 1e5,
      rho_kg_m3: 1.225,
      propDiameter_m: 1.8,
      figureOfMerit: 0.6,
    });
    expect(rel(T, Math.cbrt(2 * 1.225 * Math.PI * 0.81) * Math.pow(6e4, 2 / 3))).toBeLessThan(
      1e-12,
    );
    expect(rel(T, 2819)).toBeLessThan(1e-3);
    const model = {
      kind: 'shaftPower' as const,
      shaftPower_W: 1e5,
      propEfficiency: 0.8,
      staticThrust_N: T,
    };
    expect(thrustAt(model, 0)).toBe(T);
    expect(rel(thrustAt(model, 50), (0.8 * 1e5) / 50)).toBeLessThan(1e-12);
  });
});
