/**
 * A loiter is an orbit over a point (core/solver/legs/loiter.ts): no course, no ground
 * covered, consumption independent of the wind, and it fails only where the wind is at least
 * the airspeed ("cannot hold station").
 */
import { describe, expect, it } from 'vitest';
import { standardAtmosphere } from '../../../core/atmosphere.ts';
import { solvePlan } from '../../../core/solver/solve.ts';
import { G0 } from '../../../core/units.ts';
import { ANDERSON_PROP, loiter, makePlan, odexSolve, rel } from './fixtures.ts';

const TAS = 40;
const TIME_S = 1800;

/** The Anderson light airplane loitering at sea level at 40 m/s TAS in the given wind. */
function loiterPlan(wind: { speed_m_s: number; from_deg: number }, tas_m_s = TAS) {
  return makePlan('propeller', [
    loiter({
      course_deg: 90,
      wind,
      speed: { kind: 'tas', speed_m_s: tas_m_s },
      end: { by: 'time', time_s: TIME_S },
    }),
  ]);
}

/**
 * Fuel used over the loiter by an independent integration (odex) of dm/dt = −BSFC·D·V/η with
 * D = ½ρV²S·(CD0 + k·CL²), CL = 2mg/(ρV²S) (Anderson, Introduction to Flight, ch. 6; inputs
 * of his light airplane, shared/REFERENCES.md).
 */
function fuelByOdex(): number {
  // ISA sea level, 1.22500 kg/m³ (1976 standard, shared/REFERENCES.md).
  const rho = standardAtmosphere(0).rho_kg_m3;
  expect(rel(rho, 1.225)).toBeLessThan(1e-5);
  const { S, span, CD0, e, eta, bsfc_kg_J } = ANDERSON_PROP;
  const k = 1 / ((Math.PI * e * (span * span)) / S);
  const q = 0.5 * rho * TAS * TAS;
  const [m1] = odexSolve(
    (_t, [m]) => {
      const CL = ((m as number) * G0) / (q * S);
      return [(-bsfc_kg_J * q * S * (CD0 + k * CL * CL) * TAS) / eta];
    },
    0,
    [ANDERSON_PROP.W0_N / G0],
    TIME_S,
  );
  return ANDERSON_PROP.W0_N / G0 - (m1 as number);
}

describe('loiter: an orbit over a point', () => {
  it('a 30 m/s wind against a 40 m/s loiter on its nominal course holds station', () => {
    // Head-on to the nominal course (course 90°, wind from 90°): an orbit does not care.
    const r = solvePlan(loiterPlan({ speed_m_s: 30, from_deg: 90 }));
    const leg = r.legs[0]!;
    expect(leg.status).toBe('flown');
    expect(leg.error).toBeNull();
    // An orbit covers no ground; its air distance is V·t (definition).
    expect(leg.groundDistance_m).toBe(0);
    expect(rel(leg.airDistance_m, TAS * TIME_S)).toBeLessThan(1e-9);
    // Fuel against the independent odex integration (same in any wind).
    expect(rel(leg.fuelUsed_kg, fuelByOdex())).toBeLessThan(1e-6);
    const station = r.checks.find((c) => c.id === 'station:0');
    expect(station?.state).toBe('ok');
    // Margin (airspeed − wind)/airspeed = (40 − 30)/40 = 0.25 (the check's definition).
    expect(rel(station!.margin, 0.25)).toBeLessThan(1e-9);
  });

  it('the fuel of an orbit does not depend on the wind or the course', () => {
    const calm = solvePlan(loiterPlan({ speed_m_s: 0, from_deg: 0 }));
    const windy = solvePlan(loiterPlan({ speed_m_s: 35, from_deg: 200 }));
    // Quasi-steady level flight: the wind moves the orbit, not the drag (Anderson, ch. 6).
    expect(rel(windy.legs[0]!.fuelUsed_kg, calm.legs[0]!.fuelUsed_kg)).toBeLessThan(1e-12);
    expect(rel(calm.legs[0]!.fuelUsed_kg, fuelByOdex())).toBeLessThan(1e-6);
    // No wind: no station check (nothing to hold against).
    expect(calm.checks.some((c) => c.id === 'station:0')).toBe(false);
  });

  it('a wind stronger than the airspeed: cannot hold station, naming leg, wind and airspeed', () => {
    const r = solvePlan(loiterPlan({ speed_m_s: 45, from_deg: 10 }));
    const leg = r.legs[0]!;
    expect(leg.status).toBe('failed');
    expect(leg.stopCause).toBe('station');
    expect(leg.error).toMatch(/^Leg 1 \(loiter\): cannot hold station/);
    expect(leg.error).toContain('45 m/s');
    expect(leg.error).toContain('40 m/s');
    expect(r.verdict).toBe('fails');
    const station = r.checks.find((c) => c.id === 'station:0');
    expect(station?.state).toBe('fails');
    expect(station?.label).toBe('Leg 1 (loiter): holding station');
    expect(station?.detail).toBe(
      'Cannot hold station: the wind of 45 m/s is at least the loiter airspeed of 40 m/s.',
    );
    // Wind 45 against airspeed 40: margin (40 − 45)/40 = −0.125 (definition).
    expect(rel(station!.margin, -0.125)).toBeLessThan(1e-9);
  });

  it('a loiter needs no course in the plan file', () => {
    const plan = loiterPlan({ speed_m_s: 10, from_deg: 0 });
    const raw = JSON.parse(JSON.stringify(plan)) as { legs: Record<string, unknown>[] };
    delete raw.legs[0]!.course_deg;
    const r = solvePlan(makePlan('propeller', raw.legs as never));
    expect(r.legs[0]!.status).toBe('flown');
    expect(rel(r.legs[0]!.fuelUsed_kg, fuelByOdex())).toBeLessThan(1e-6);
  });
});
