import { describe, expect, it } from 'vitest';
import { atmosphereAt } from '../../core/atmosphere.ts';
import { InputError } from '../../core/errors.ts';
import type {
  ElectricPowerplant,
  JetPowerplant,
  PropellerPowerplant,
} from '../../core/plan/schema.ts';
import {
  availableThrustPower_W,
  batteryPower_W,
  chainEfficiency,
  consumableOf,
  consumptionRate,
  fuelDensity_kg_L,
  jetFuelFlow_kg_s,
  maxShaftPower_W,
  maxThrust_N,
  peukertDrainRate_W,
  propFuelFlow_kg_s,
  usableEnergy_J,
  weightSpecificBsfc_1_m,
  weightSpecificTsfc_1_s,
} from '../../core/propulsion/index.ts';
import { HOUR, HP, LB, LBF, toSI } from '../../core/units.ts';

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);
const RHO0 = 1.225; // 1976 U.S. Standard Atmosphere, sea level

const fuel = { kind: 'jetA1' as const, load_kg: 1000, tankCapacity_L: 2000 };

const jet: JetPowerplant = {
  type: 'jet',
  maxThrustSL_N: 20000,
  thrustLapseExponent: 0.8,
  tsfc_kg_Ns: toSI(0.6, 'lb_lbfh'),
  idleFuelFraction: 0.1,
  fuel,
};

const piston: PropellerPowerplant = {
  type: 'propeller',
  engine: 'piston',
  maxPowerSL_W: 230 * HP,
  lapse: { model: 'gaggFerrar' },
  criticalAltitude_m: 0,
  propEfficiency: 0.8,
  bsfc_kg_J: toSI(0.45, 'lb_hph'),
  idlePowerFraction: 0.1,
  fuel: { kind: 'avgas', load_kg: 150, tankCapacity_L: 250 },
};

const electric: ElectricPowerplant = {
  type: 'electric',
  maxShaftPower_W: 800,
  motorEfficiency: 0.9,
  controllerEfficiency: 0.95,
  propEfficiency: 0.7,
  battery: {
    energy_J: 14.8 * 5 * 3600,
    mass_kg: 0.5,
    usableFraction: 0.8,
    peukertExponent: 1.2,
    ratedDischargeTime_s: HOUR,
  },
};

function field(fn: () => unknown): string {
  try {
    fn();
  } catch (err) {
    if (err instanceof InputError) return err.field;
    throw err;
  }
  return '(no error)';
}

describe('fuel consumption units', () => {
  it('TSFC and BSFC conversions match the derived factors', () => {
    // REFERENCES.md derived from NIST SP 811: 1 lb/(lbf·h) = 28.3255 mg/(N·s), 1 lb/(hp·h) = 608.277 g/kWh.
    expect(rel(toSI(1, 'lb_lbfh'), 28.3255e-6)).toBeLessThan(2e-6);
    expect(rel(toSI(1, 'lb_hph'), 608.277e-3 / 3.6e6)).toBeLessThan(2e-6);
  });

  it('weight-specific consumptions: 0.6 lb/(lbf·h) is c_t = 0.6 1/h, 0.45 lb/(hp·h) is 7.456e-7 1/m', () => {
    // lbf = lb·g0 exactly (NIST SP 811), so c_t = TSFC·g0 is 0.6 per hour.
    expect(rel(weightSpecificTsfc_1_s(jet), 0.6 / HOUR)).toBeLessThan(1e-14);
    // Anderson, Introduction to Flight, ch. 6, as quoted in REFERENCES.md (4 significant digits).
    expect(rel(weightSpecificBsfc_1_m(piston), 7.456e-7)).toBeLessThan(5e-4);
  });

  it('fuel flows are TSFC·T and BSFC·P', () => {
    // 1000 lbf at 0.6 lb/(lbf·h) burns 600 lb/h (definition of TSFC; NIST SP 811 factors).
    expect(rel(jetFuelFlow_kg_s(jet, 1000 * LBF), (600 * LB) / HOUR)).toBeLessThan(1e-14);
    // 150 hp at 0.45 lb/(hp·h) burns 67.5 lb/h (definition of BSFC; NIST SP 811 factors).
    expect(rel(propFuelFlow_kg_s(piston, 150 * HP), (67.5 * LB) / HOUR)).toBeLessThan(1e-14);
  });
});

describe('jet thrust lapse T = T_SL·σ^n (common practice)', () => {
  it('at 11 000 m uses the standard density 0.363918 kg/m³', () => {
    // 1976 U.S. Standard Atmosphere table, H = 11 000 m.
    const T = maxThrust_N(jet, atmosphereAt(11000));
    expect(rel(T, 20000 * Math.pow(0.363918 / RHO0, 0.8))).toBeLessThan(1e-5);
  });
});

describe('propeller power lapse', () => {
  it('Gagg–Ferrar: full power at sea level, 1.132σ − 0.132 at 2000 m', () => {
    // Gagg & Ferrar 1934 as cited by Gudmundsson, ch. 7 (from memory); density from the
    // 1976 U.S. Standard Atmosphere table (2000 m: 1.00649 kg/m³).
    expect(rel(maxShaftPower_W(piston, atmosphereAt(0), 0), 230 * HP)).toBeLessThan(1e-5);
    const sigma = 1.00649 / RHO0;
    const P = maxShaftPower_W(piston, atmosphereAt(2000), 2000);
    expect(rel(P, 230 * HP * (1.132 * sigma - 0.132))).toBeLessThan(1e-5);
  });

  it('Gagg–Ferrar on a hot day: ISA+15 at sea level (ρ 1.16439) costs power', () => {
    // REFERENCES.md computed ISA-offset check: Hp 0 m, +15 K → ρ 1.16439 kg/m³.
    const P = maxShaftPower_W(piston, atmosphereAt(0, 15), 0);
    expect(rel(P, 230 * HP * (1.132 * (1.16439 / RHO0) - 0.132))).toBeLessThan(1e-5);
  });

  it('Gagg–Ferrar gives no power where it crosses zero (σ < 0.1166), never a negative one', () => {
    // 20 000 m: σ = 0.0880349/1.225 (1976 standard table), below the zero of 1.132σ − 0.132.
    expect(maxShaftPower_W(piston, atmosphereAt(20000), 20000)).toBe(0);
  });

  it('density-power lapse σ^n', () => {
    // Common practice lapse; density from the 1976 standard table at 5000 m (0.736116 kg/m³).
    const turboprop: PropellerPowerplant = {
      ...piston,
      engine: 'turboprop',
      lapse: { model: 'densityPower', exponent: 0.7 },
    };
    const P = maxShaftPower_W(turboprop, atmosphereAt(5000), 5000);
    expect(rel(P, 230 * HP * Math.pow(0.736116 / RHO0, 0.7))).toBeLessThan(1e-5);
  });

  it('critical altitude: full power up to it, lapse on σ/σ_crit above, continuous at it', () => {
    // Model: common practice for turbo-normalised engines; σ ratios from the atmosphere module.
    const turbo: PropellerPowerplant = { ...piston, criticalAltitude_m: 3000 };
    for (const dT of [0, 15, -20]) {
      expect(rel(maxShaftPower_W(turbo, atmosphereAt(2500, dT), 2500), 230 * HP)).toBeLessThan(
        1e-14,
      );
      expect(rel(maxShaftPower_W(turbo, atmosphereAt(3000, dT), 3000), 230 * HP)).toBeLessThan(
        1e-14,
      );
      const ratio = atmosphereAt(6000, dT).sigma / atmosphereAt(3000, dT).sigma;
      const P6 = maxShaftPower_W(turbo, atmosphereAt(6000, dT), 6000);
      expect(rel(P6, 230 * HP * (1.132 * ratio - 0.132))).toBeLessThan(1e-12);
      const justAbove = maxShaftPower_W(turbo, atmosphereAt(3000.001, dT), 3000.001);
      expect(rel(justAbove, 230 * HP)).toBeLessThan(1e-6);
    }
  });
});

describe('electric drivetrain and Peukert (Traub 2011)', () => {
  const battery = electric.battery;

  it('chain efficiency, battery power and usable energy', () => {
    // Products and quotients by definition (series efficiencies, usable fraction).
    expect(rel(chainEfficiency(electric), 0.9 * 0.95 * 0.7)).toBeLessThan(1e-15);
    expect(rel(batteryPower_W(electric, 100), 100 / (0.9 * 0.95 * 0.7))).toBeLessThan(1e-15);
    expect(rel(usableEnergy_J(battery), 0.8 * battery.energy_J)).toBeLessThan(1e-15);
  });

  it('drain = P·(P·Rt/E)^(n−1): equal to P at the rated rate and at n = 1, larger when faster', () => {
    // Traub 2011 in energy form (see core/propulsion/electric.ts).
    const ratedPower = battery.energy_J / battery.ratedDischargeTime_s;
    expect(rel(peukertDrainRate_W(battery, ratedPower), ratedPower)).toBeLessThan(1e-14);
    expect(rel(peukertDrainRate_W({ ...battery, peukertExponent: 1 }, 50), 50)).toBeLessThan(1e-15);
    const P = 2 * ratedPower;
    expect(rel(peukertDrainRate_W(battery, P), P * Math.pow(2, 0.2))).toBeLessThan(1e-14);
    expect(peukertDrainRate_W(battery, 0)).toBe(0);
  });

  it('below the rated discharge power the drain is P: no credit beyond the rated energy', () => {
    // Traub 2011 fits the correction at and above the rated current (from memory); below it the
    // formula would drain less than P, i.e. deliver more than the rated energy.
    const ratedPower = battery.energy_J / battery.ratedDischargeTime_s;
    for (const f of [0.01, 0.5, 0.999]) {
      expect(peukertDrainRate_W(battery, f * ratedPower)).toBe(f * ratedPower);
    }
    expect(peukertDrainRate_W(battery, 1.001 * ratedPower)).toBeGreaterThan(1.001 * ratedPower);
  });
});

describe('one interface for the solver', () => {
  const sl = atmosphereAt(0);
  const V = 50;

  it('consumable and fuel density', () => {
    expect(consumableOf(jet)).toBe('fuel');
    expect(consumableOf(piston)).toBe('fuel');
    expect(consumableOf(electric)).toBe('battery');
    // Typical densities are common practice (core/units.ts); an override wins.
    expect(fuelDensity_kg_L(piston.fuel)).toBe(0.72);
    expect(fuelDensity_kg_L({ ...fuel, density_kg_L: 0.79 })).toBe(0.79);
  });

  it('available thrust power: T_max·V, η·P_max, η_prop·P_shaft', () => {
    expect(rel(availableThrustPower_W(jet, sl, 0, V), 20000 * V)).toBeLessThan(1e-5);
    expect(rel(availableThrustPower_W(piston, sl, 0, V), 0.8 * 230 * HP)).toBeLessThan(1e-5);
    expect(rel(availableThrustPower_W(electric, sl, 0, V), 0.7 * 800)).toBeLessThan(1e-15);
  });

  it('consumption above idle: TSFC·P/V, BSFC·P/η, Peukert drain of P/η_chain', () => {
    const Pt = 200000;
    expect(rel(consumptionRate(jet, Pt, V, sl, 0), jet.tsfc_kg_Ns * (Pt / V))).toBeLessThan(1e-14);
    const Pp = 80000;
    expect(rel(consumptionRate(piston, Pp, V, sl, 0), piston.bsfc_kg_J * (Pp / 0.8))).toBeLessThan(
      1e-14,
    );
    const Pe = 150;
    const drain = peukertDrainRate_W(electric.battery, Pe / chainEfficiency(electric));
    expect(rel(consumptionRate(electric, Pe, V, sl, 0), drain)).toBeLessThan(1e-14);
  });

  it('consumption at or below idle (also negative thrust power in a descent)', () => {
    for (const Pt of [0, -5000, 10]) {
      const jetIdle = 0.1 * jet.tsfc_kg_Ns * maxThrust_N(jet, sl);
      expect(rel(consumptionRate(jet, Pt, V, sl, 0), jetIdle)).toBeLessThan(1e-14);
      const propIdle = piston.bsfc_kg_J * 0.1 * maxShaftPower_W(piston, sl, 0);
      expect(rel(consumptionRate(piston, Pt, V, sl, 0), propIdle)).toBeLessThan(1e-14);
    }
    expect(consumptionRate(electric, -100, V, sl, 0)).toBe(0);
  });

  it('refuses bad input naming the parameter', () => {
    expect(field(() => consumptionRate(jet, 1000, 0, sl, 0))).toBe('V_m_s');
    expect(field(() => consumptionRate(jet, NaN, V, sl, 0))).toBe('thrustPower_W');
    expect(field(() => availableThrustPower_W(piston, sl, 0, -3))).toBe('V_m_s');
    expect(field(() => jetFuelFlow_kg_s(jet, -1))).toBe('thrust_N');
    expect(field(() => propFuelFlow_kg_s(piston, Infinity))).toBe('shaftPower_W');
    expect(field(() => maxThrust_N({ ...jet, maxThrustSL_N: 0 }, sl))).toBe('maxThrustSL_N');
    expect(field(() => maxShaftPower_W(piston, sl, NaN))).toBe('pressureAltitude_m');
    expect(field(() => peukertDrainRate_W({ ...electric.battery, peukertExponent: 0.9 }, 10))).toBe(
      'peukertExponent',
    );
    expect(field(() => batteryPower_W({ ...electric, motorEfficiency: 1.1 }, 10))).toBe(
      'motorEfficiency',
    );
  });
});
