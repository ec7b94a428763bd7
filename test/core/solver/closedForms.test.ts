/**
 * The integrator against the closed forms (DESIGN.md §3: agree to 1e-6 relative where a
 * closed form applies). Closed forms from core/breguet.ts and core/electricEndurance.ts
 * (Anderson, Introduction to Flight, ch. 6 and Aircraft Performance and Design, ch. 5;
 * Traub, J. Aircraft 48(2), 2011). Zero wind, zero reserves, idle floors off.
 */
import { describe, expect, it } from 'vitest';
import {
  enduranceJetConstantCL,
  endurancePropConstantAltitudeCL,
  rangeJetConstantAltitudeCL,
  rangeJetConstantAltitudeSpeed,
  rangeJetCruiseClimb,
  rangePropConstantAltitudeSpeed,
  rangePropConstantCL,
} from '../../../core/breguet.ts';
import { enduranceElectricTraub, rangeElectricTraub } from '../../../core/electricEndurance.ts';
import { ambientAt, buildModel } from '../../../core/solver/model.ts';
import { flySegment, type Independent } from '../../../core/solver/segment.ts';
import { solvePlan } from '../../../core/solver/solve.ts';
import { G0 } from '../../../core/units.ts';
import {
  ANDERSON_JET,
  ANDERSON_PROP,
  TRAUB_UAV,
  cruise,
  electricPowerplant,
  loiter,
  makePlan,
  rel,
  type Kind,
} from './fixtures.ts';

const kProp = 1 / ((Math.PI * ANDERSON_PROP.e * ANDERSON_PROP.span ** 2) / ANDERSON_PROP.S);
const kJet = 1 / ((Math.PI * ANDERSON_JET.e * ANDERSON_JET.span ** 2) / ANDERSON_JET.S);
const cp = ANDERSON_PROP.bsfc_kg_J * G0;
const ct = ANDERSON_JET.ct_1_s;
const W0prop = ANDERSON_PROP.W0_N;
const W1prop = ANDERSON_PROP.W0_N - ANDERSON_PROP.fuel_N;
const W0jet = ANDERSON_JET.W0_N;
const W1jet = ANDERSON_JET.W0_N - ANDERSON_JET.fuel_N;

/** Lower-level flight at a constant CL and altitude, ended by burning all the fuel. */
function constantCL(kind: Kind, h_m: number, CL: number, indep: Independent = 'q') {
  const plan = makePlan(kind, [cruise()], { departure_m: Math.min(h_m, 5000) });
  const model = buildModel(plan);
  const start = {
    t_s: 0,
    x_m: 0,
    air_m: 0,
    h_m,
    mass_kg: model.takeoffMass_kg,
    left: model.consumableStart,
  };
  const seg = flySegment(
    model,
    {
      path: {
        speed: { kind: 'constantCL', CL },
        vertical: { kind: 'level' },
        headwind_m_s: 0,
        crosswind_m_s: 0,
        field: 'test',
      },
      indep,
      to: 0,
      limits: [],
      samples: 0,
    },
    start,
  );
  expect(seg.stoppedBy).toBeNull();
  return { seg, rho: ambientAt(model, h_m).atm.rho_kg_m3 };
}

describe('jet (c_t = 0.6 1/h, Anderson business jet)', () => {
  it('cruise-climb range = (V/c_t)(CL/CD) ln(W0/W1)', () => {
    const V = 200;
    const h0 = 5000;
    const plan = makePlan(
      'jet',
      [
        cruise({
          end: { by: 'fuel', fuel_kg: ANDERSON_JET.fuel_N / G0 },
          speed: { kind: 'tas', speed_m_s: V },
          program: 'cruiseClimb',
        }),
      ],
      { departure_m: h0 },
    );
    const r = solvePlan(plan);
    expect(r.completed).toBe(true);
    const rho = ambientAt(buildModel(plan), h0).atm.rho_kg_m3;
    const CL = (2 * W0jet) / (rho * V * V * ANDERSON_JET.S);
    const CD = ANDERSON_JET.CD0 + kJet * CL * CL;
    const R = rangeJetCruiseClimb({ ct, V, CL, CD, W0: W0jet, W1: W1jet });
    expect(rel(r.legs[0]!.groundDistance_m, R)).toBeLessThan(1e-6);
    // Altitude follows the weight: ρ_end = ρ_0·W1/W0 (constant V and CL).
    const rhoEnd = ambientAt(buildModel(plan), r.legs[0]!.end.h_m).atm.rho_kg_m3;
    expect(rel(rhoEnd, (rho * W1jet) / W0jet)).toBeLessThan(1e-8);
  });

  it('constant altitude, constant CL: R = (2/c_t)√(2/(ρS))(CL^½/CD)(√W0 − √W1)', () => {
    const CL = Math.sqrt(ANDERSON_JET.CD0 / (3 * kJet));
    const { seg, rho } = constantCL('jet', 7000, CL);
    const CD = ANDERSON_JET.CD0 + kJet * CL * CL;
    const R = rangeJetConstantAltitudeCL({
      ct,
      rho,
      S: ANDERSON_JET.S,
      CL,
      CD,
      W0: W0jet,
      W1: W1jet,
    });
    expect(rel(seg.end.x_m, R)).toBeLessThan(1e-6);
  });

  it('constant altitude, constant speed: arctangent range form', () => {
    const V = 180;
    const h = 5000;
    const plan = makePlan(
      'jet',
      [
        cruise({
          end: { by: 'fuel', fuel_kg: ANDERSON_JET.fuel_N / G0 },
          speed: { kind: 'tas', speed_m_s: V },
        }),
      ],
      { departure_m: h },
    );
    const r = solvePlan(plan);
    const rho = ambientAt(buildModel(plan), h).atm.rho_kg_m3;
    const R = rangeJetConstantAltitudeSpeed({
      ct,
      V,
      rho,
      S: ANDERSON_JET.S,
      CD0: ANDERSON_JET.CD0,
      k: kJet,
      W0: W0jet,
      W1: W1jet,
    });
    expect(r.completed).toBe(true);
    expect(rel(r.legs[0]!.groundDistance_m, R)).toBeLessThan(1e-6);
  });

  it('endurance at constant CL: E = (1/c_t)(CL/CD) ln(W0/W1)', () => {
    const CL = Math.sqrt(ANDERSON_JET.CD0 / kJet);
    const { seg } = constantCL('jet', 9000, CL);
    const CD = 2 * ANDERSON_JET.CD0;
    const E = enduranceJetConstantCL({ ct, CL, CD, W0: W0jet, W1: W1jet });
    expect(rel(seg.end.t_s, E)).toBeLessThan(1e-6);
  });
});

describe('propeller (Anderson light airplane, η = 0.8, 0.45 lb/(hp·h))', () => {
  it('constant altitude, constant speed: arctangent range form', () => {
    const V = 60;
    const plan = makePlan('propeller', [
      cruise({
        end: { by: 'fuel', fuel_kg: ANDERSON_PROP.fuel_N / G0 },
        speed: { kind: 'tas', speed_m_s: V },
      }),
    ]);
    const r = solvePlan(plan);
    const rho = ambientAt(buildModel(plan), 0).atm.rho_kg_m3;
    const R = rangePropConstantAltitudeSpeed({
      eta: ANDERSON_PROP.eta,
      cp,
      V,
      rho,
      S: ANDERSON_PROP.S,
      CD0: ANDERSON_PROP.CD0,
      k: kProp,
      W0: W0prop,
      W1: W1prop,
    });
    expect(r.completed).toBe(true);
    expect(rel(r.legs[0]!.groundDistance_m, R)).toBeLessThan(1e-6);
  });

  it('constant CL: R = (η/c_p)(CL/CD) ln(W0/W1); at (L/D)max near Anderson’s 1.939e6 m', () => {
    const CL = Math.sqrt(ANDERSON_PROP.CD0 / kProp);
    const { seg } = constantCL('propeller', 0, CL);
    const CD = 2 * ANDERSON_PROP.CD0;
    const R = rangePropConstantCL({ eta: ANDERSON_PROP.eta, cp, CL, CD, W0: W0prop, W1: W1prop });
    expect(rel(seg.end.x_m, R)).toBeLessThan(1e-6);
    expect(rel(seg.end.x_m, 1.939e6)).toBeLessThan(5e-4); // REFERENCES.md: computed 1.939e6 m (4 digits)
  });

  it('endurance at constant altitude and CL: E = (η/c_p)(CL^1.5/CD)√(2ρS)(W1^−½ − W0^−½)', () => {
    const CL = Math.sqrt((3 * ANDERSON_PROP.CD0) / kProp);
    const { seg, rho } = constantCL('propeller', 0, CL);
    const CD = 4 * ANDERSON_PROP.CD0;
    const E = endurancePropConstantAltitudeCL({
      eta: ANDERSON_PROP.eta,
      cp,
      rho,
      S: ANDERSON_PROP.S,
      CL,
      CD,
      W0: W0prop,
      W1: W1prop,
    });
    expect(rel(seg.end.t_s, E)).toBeLessThan(1e-6);
    expect(rel(seg.end.t_s, 5.175e4)).toBeLessThan(5e-4); // REFERENCES.md: computed 5.175e4 s (4 digits)
  });
});

describe('electric at a fixed speed (Traub 2011)', () => {
  const V = 10;
  // At 10 m/s the pack gives P_req/η ≈ 25 W. Traub's Peukert law applies at or above the rated
  // discharge power E/Rt (core/propulsion/electric.ts): with Rt = 20 h, E/Rt = 3.7 W, so it
  // applies here; with Rt = 1 h (74 W) it does not, and the drain is P (t = η·E/P).
  for (const [n, Rt] of [
    [1, 3600],
    [1.2, 72_000],
    [1.2, 3600],
  ] as const) {
    const above = Rt === 72_000;
    const form = above ? 'Rt^(1−n)(η·E/P)^n' : 'η·E/P (below the rated power)';
    it(`endurance and range with Peukert n = ${n}, Rt = ${Rt} s: t = ${form}, R = V·t`, () => {
      const plan = makePlan(
        'electric',
        [
          cruise({
            end: { by: 'energy', energy_J: TRAUB_UAV.energy_J },
            speed: { kind: 'tas', speed_m_s: V },
          }),
        ],
        {
          powerplant: electricPowerplant({}, { peukertExponent: n, ratedDischargeTime_s: Rt }),
        },
      );
      const r = solvePlan(plan);
      expect(r.completed).toBe(true);
      const rho = ambientAt(buildModel(plan), 0).atm.rho_kg_m3;
      const W = TRAUB_UAV.m * G0;
      const k = 1 / (Math.PI * TRAUB_UAV.e * TRAUB_UAV.AR);
      // Traub 2011: P_req = ½ρU³S·CD0 + 2W²k/(ρUS)
      const P =
        0.5 * rho * V ** 3 * TRAUB_UAV.S * TRAUB_UAV.CD0 +
        (2 * W * W * k) / (rho * V * TRAUB_UAV.S);
      expect(P / TRAUB_UAV.eta > TRAUB_UAV.energy_J / Rt).toBe(above);
      const args = {
        energy_J: TRAUB_UAV.energy_J,
        eta: TRAUB_UAV.eta,
        powerRequired_W: P,
        peukertExponent: above ? n : 1,
        ratedTime_s: Rt,
      };
      expect(rel(r.legs[0]!.time_s, enduranceElectricTraub(args))).toBeLessThan(1e-6);
      expect(rel(r.legs[0]!.groundDistance_m, rangeElectricTraub({ ...args, V }))).toBeLessThan(
        1e-6,
      );
    });

    it(`loiter for that endurance (n = ${n}, Rt = ${Rt} s) uses exactly the usable energy`, () => {
      const base = makePlan('electric', [cruise()]);
      const rho = ambientAt(buildModel(base), 0).atm.rho_kg_m3;
      const W = TRAUB_UAV.m * G0;
      const k = 1 / (Math.PI * TRAUB_UAV.e * TRAUB_UAV.AR);
      const P =
        0.5 * rho * V ** 3 * TRAUB_UAV.S * TRAUB_UAV.CD0 +
        (2 * W * W * k) / (rho * V * TRAUB_UAV.S);
      const t = enduranceElectricTraub({
        energy_J: TRAUB_UAV.energy_J,
        eta: TRAUB_UAV.eta,
        powerRequired_W: P,
        peukertExponent: above ? n : 1,
        ratedTime_s: Rt,
      });
      const plan = makePlan(
        'electric',
        [
          loiter({
            end: { by: 'time', time_s: t * (1 - 1e-9) },
            speed: { kind: 'tas', speed_m_s: V },
          }),
        ],
        {
          powerplant: electricPowerplant({}, { peukertExponent: n, ratedDischargeTime_s: Rt }),
        },
      );
      const r = solvePlan(plan);
      expect(r.completed).toBe(true);
      expect(rel(r.legs[0]!.energyUsed_J, TRAUB_UAV.energy_J)).toBeLessThan(1e-6);
    });
  }
});
