/**
 * `npm run demo`: characteristic speeds and a closed-form range for a fictional
 * demo aircraft, printed in SI and aviation units. The aircraft is invented for
 * demonstration; its numbers sit in the common-practice ranges of a four-seat piston.
 */
import { atmosphereAt } from '../core/atmosphere.ts';
import { rangePropConstantCL, endurancePropConstantAltitudeCL } from '../core/breguet.ts';
import { formatQuantity } from '../core/format.ts';
import {
  maxLiftToDrag,
  minPowerPoint,
  minDragSpeed,
  minPowerSpeed,
  polarCoefficients,
  stallSpeed,
  jetBestRangePoint,
  speedForLiftCoefficient,
} from '../core/polar.ts';
import { G0, LB, HP, HOUR } from '../core/units.ts';
import type { UnitSystemId } from '../core/units.ts';
import type { Polar } from '../core/plan/schema.ts';

export const CAUTION =
  'CAUTION: estimates for planning only. The aircraft’s approved documents, local regulations and licensed practice take precedence.';

const demo = {
  name: 'Thornbill TB-2 (fictional four-seat piston tourer)',
  mass_kg: 1150,
  fuel_kg: 140,
  wingArea_m2: 15.2,
  polar: {
    CD0: 0.029,
    induced: { by: 'geometry', e: 0.78, AR: 7.8 },
    CLminD: 0,
    CLmax: 1.45,
  } as Polar,
  propEfficiency: 0.82,
  bsfc_kg_J: (0.46 * LB) / (HP * HOUR), // 0.46 lb/(hp·h), inside the common piston range
  cruiseAltitude_m: 2400,
  isaOffset_K: 0,
};

function main(): void {
  const c = polarCoefficients(demo.polar);
  const atm = atmosphereAt(demo.cruiseAltitude_m, demo.isaOffset_K);
  const W0 = demo.mass_kg * G0;
  const W1 = (demo.mass_kg - demo.fuel_kg) * G0;
  const S = demo.wingArea_m2;
  const best = maxLiftToDrag(c);
  const minPower = minPowerPoint(c);
  const jetRange = jetBestRangePoint(c);
  const cp = demo.bsfc_kg_J * G0;

  const rows: [string, number, 'airspeed' | 'distance' | 'time'][] = [
    ['stall speed (clean)', stallSpeed(W0, atm.rho_kg_m3, S, c.CLmax), 'airspeed'],
    [
      '1.2 × stall speed (lowest planning speed, common practice)',
      1.2 * stallSpeed(W0, atm.rho_kg_m3, S, c.CLmax),
      'airspeed',
    ],
    ['minimum-power speed (best endurance)', minPowerSpeed(c, W0, atm.rho_kg_m3, S), 'airspeed'],
    [
      'minimum-drag speed (best glide, best propeller range)',
      minDragSpeed(c, W0, atm.rho_kg_m3, S),
      'airspeed',
    ],
    [
      'max CL^0.5/CD speed (jet best range, for comparison)',
      speedForLiftCoefficient(W0, atm.rho_kg_m3, S, jetRange.CL),
      'airspeed',
    ],
    [
      'Breguet range at (L/D)max, constant CL',
      rangePropConstantCL({ eta: demo.propEfficiency, cp, CL: best.CL, CD: best.CD, W0, W1 }),
      'distance',
    ],
    [
      'Breguet endurance at min power, constant altitude',
      endurancePropConstantAltitudeCL({
        eta: demo.propEfficiency,
        cp,
        rho: atm.rho_kg_m3,
        S,
        CL: minPower.CL,
        CD: minPower.CD,
        W0,
        W1,
      }),
      'time',
    ],
  ];

  console.log(`${demo.name}`);
  console.log(
    `CD0 ${c.CD0}, k ${c.k.toFixed(5)}, (L/D)max ${best.LD.toFixed(2)} at CL ${best.CL.toFixed(3)}; ` +
      `max CL^1.5/CD ${minPower.value.toFixed(2)} at CL ${minPower.CL.toFixed(3)}`,
  );
  for (const system of ['si', 'aviation'] as UnitSystemId[]) {
    console.log(
      `\n[${system === 'si' ? 'SI' : 'aviation'} units] take-off mass ${formatQuantity(demo.mass_kg, 'mass', system)}, ` +
        `fuel ${formatQuantity(demo.fuel_kg, 'fuelMass', system)}, altitude ${formatQuantity(demo.cruiseAltitude_m, 'altitude', system)} ISA`,
    );
    for (const [label, value, quantity] of rows) {
      console.log(`  ${label.padEnd(60)} ${formatQuantity(value, quantity, system)}`);
    }
  }
  console.log(
    '\nClosed forms assume constant CL, propeller efficiency and BSFC over the whole fuel burn, and no reserve;' +
      '\nthe minimum-power speed may lie below the stall margin, in which case the mission solver flies the margin speed.',
  );
  console.log(`\n${CAUTION}`);
}

main();
