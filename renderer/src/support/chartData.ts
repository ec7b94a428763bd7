/**
 * Chart data in display units, from a plan and its result: the mission profile, the drag
 * polar with each leg's operating points, power (or thrust) required and available, and
 * payload against range. Pure functions; the unit system comes in as a parameter.
 */
import type { Plan } from '../../../core/plan/schema.ts';
import type { LegResult, PlanResult } from '../../../core/solver/types.ts';
import type { PowerCurves } from '../../../core/optimize/curves.ts';
import type { PayloadRangePoint } from '../../../core/optimize/payloadRange.ts';
import { dragCoefficient, liftToDrag, polarCoefficients } from '../../../core/polar.ts';
import { displayValue } from '../../../core/format.ts';
import { UNITS, unitMap, type Quantity, type UnitSystem } from '../../../core/units.ts';
import { horizontalMark, verticalMark, type ChartSpec, type Series, type XY } from './chartSpec.ts';
import type { BandPoint } from './confidence.ts';

const label = (q: Quantity, system: UnitSystem) => UNITS[unitMap(system)[q]].label;

export type ProfileAxis = 'distance' | 'time';

/**
 * Altitude and fuel (or battery state of charge) along the mission, by distance or time;
 * with a Monte Carlo run, the 5th to 95th percentile of what is on board at each leg end.
 */
export function profileChart(
  result: PlanResult,
  axis: ProfileAxis,
  system: UnitSystem,
  band: readonly BandPoint[] = [],
): ChartSpec {
  const battery = result.consumable === 'battery';
  const startEnergy = result.legs[0]?.start.energy_J ?? 0;
  const xOf = (leg: LegResult, j: number) =>
    axis === 'distance'
      ? displayValue(leg.series.x_m[j] ?? 0, 'distance', system, { decimals: 3 })
      : displayValue(leg.series.t_s[j] ?? 0, 'time', system, { decimals: 3 });
  const altitude: XY[] = [];
  const boundaries: XY[] = [];
  const left: XY[] = [];
  const failed: XY[] = [];
  for (const leg of result.legs) {
    if (leg.status === 'notReached') continue;
    const n = leg.series.t_s.length;
    for (let j = 0; j < n; j++) {
      const x = xOf(leg, j);
      const h = displayValue(leg.series.h_m[j] ?? 0, 'altitude', system, { decimals: 1 });
      altitude.push({ x, y: h });
      if (j === n - 1) boundaries.push({ x, y: h });
      const y2 = battery
        ? startEnergy > 0
          ? (100 * (leg.series.energy_J[j] ?? 0)) / startEnergy
          : 0
        : displayValue(leg.series.fuel_kg[j] ?? 0, 'fuelMass', system, { decimals: 3 });
      left.push({ x, y: y2 });
      if (leg.status === 'failed') failed.push({ x, y: h });
    }
  }
  const series: Series[] = [
    { label: 'Altitude', role: 'line', axis: 'y', points: altitude },
    { label: 'Leg ends', role: 'points', axis: 'y', points: boundaries },
    {
      label: battery ? 'State of charge' : 'Fuel on board',
      role: 'line2',
      axis: 'y2',
      points: left,
    },
  ];
  if (failed.length > 0)
    series.push({ label: 'Leg that fails', role: 'fail', axis: 'y', points: failed });
  if (band.length > 1) {
    const y = (v: number) =>
      battery
        ? startEnergy > 0
          ? (100 * v) / startEnergy
          : 0
        : displayValue(v, 'fuelMass', system, { decimals: 3 });
    const x = (b: BandPoint) =>
      axis === 'distance'
        ? displayValue(b.x_m, 'distance', system, { decimals: 3 })
        : displayValue(b.t_s, 'time', system, { decimals: 3 });
    const what = battery ? 'Charge' : 'Fuel';
    series.push(
      {
        label: `${what}, 5th percentile`,
        role: 'bandLow',
        axis: 'y2',
        points: band.map((b) => ({ x: x(b), y: y(b.p5) })),
      },
      {
        label: `${what}, 5–95 % of simulated flights`,
        role: 'bandHigh',
        axis: 'y2',
        points: band.map((b) => ({ x: x(b), y: y(b.p95) })),
      },
    );
  }
  return {
    xTitle: axis === 'distance' ? `Ground distance (${label('distance', system)})` : 'Time (min)',
    // The profile is drawn above mean sea level whatever the boxes show (heightReference.ts).
    yTitle: `Altitude (${label('altitude', system)} MSL)`,
    y2Title: battery ? 'State of charge (%)' : `Fuel (${label('fuelMass', system)})`,
    ...(battery ? { y2Max: 100 } : {}),
    series,
  };
}

/** CD against CL and L/D against CL over the polar's range, each flown leg's CL span marked. */
export function polarChart(plan: Plan, result: PlanResult | null): ChartSpec {
  const c = polarCoefficients(plan.aircraft.polar);
  const lo = Math.min(0, c.CLminD - 0.3);
  const hi = c.CLmax;
  const curve: XY[] = [];
  const ld: XY[] = [];
  const n = 60;
  for (let i = 0; i <= n; i++) {
    const CL = lo + ((hi - lo) * i) / n;
    curve.push({ x: CL, y: dragCoefficient(c, CL) });
    if (CL > 0) ld.push({ x: CL, y: liftToDrag(c, CL) });
  }
  const ops: XY[] = [];
  const opsLD: XY[] = [];
  for (const leg of result?.legs ?? []) {
    if (leg.status === 'notReached' || !(leg.CL.max > 0)) continue;
    for (const CL of leg.CL.min === leg.CL.max ? [leg.CL.min] : [leg.CL.min, leg.CL.max]) {
      ops.push({ x: CL, y: dragCoefficient(c, CL) });
      opsLD.push({ x: CL, y: liftToDrag(c, CL) });
    }
  }
  return {
    xTitle: 'Lift coefficient CL',
    yTitle: 'Drag coefficient CD',
    y2Title: 'L/D',
    beginAtZero: true,
    series: [
      { label: 'CD (polar)', role: 'line', axis: 'y', points: curve },
      { label: 'L/D', role: 'line2', axis: 'y2', points: ld },
      { label: 'Legs: CD', role: 'points', axis: 'y', points: ops },
      { label: 'Legs: L/D', role: 'points', axis: 'y2', points: opsLD },
    ],
  };
}

export type PowerView = 'power' | 'thrust';

/** Power (or thrust) required and available across TAS, stall and optimum speeds marked. */
export function powerChart(curves: PowerCurves, view: PowerView, system: UnitSystem): ChartSpec {
  const v = (tas: number) => displayValue(tas, 'airspeed', system, { decimals: 2 });
  const y = (value: number) =>
    view === 'power'
      ? displayValue(value, 'power', system, { decimals: 3 })
      : displayValue(value, 'thrust', system, { decimals: 2 });
  const req = view === 'power' ? curves.required_W : curves.thrustRequired_N;
  const avail = view === 'power' ? curves.available_W : curves.thrustAvailable_N;
  const required = curves.tas_m_s.map((tas, i) => ({ x: v(tas), y: y(req[i] ?? 0) }));
  const available = curves.tas_m_s.map((tas, i) => ({ x: v(tas), y: y(avail[i] ?? 0) }));
  const ceiling = Math.max(...required.map((p) => p.y), ...available.map((p) => p.y), 0);
  const m = curves.marks;
  const marks = [
    verticalMark('Stall', v(m.stall_m_s), 0, ceiling),
    verticalMark('Best range', v(m.bestRange_m_s), 0, ceiling),
    verticalMark('Best endurance', v(m.bestEndurance_m_s), 0, ceiling),
    ...(m.maxLevel_m_s !== null
      ? [verticalMark('Max level speed', v(m.maxLevel_m_s), 0, ceiling)]
      : []),
  ];
  const what = view === 'power' ? 'Power' : 'Thrust';
  const unit = view === 'power' ? label('power', system) : label('thrust', system);
  return {
    xTitle: `True airspeed (${label('airspeed', system)})`,
    yTitle: `${what} (${unit})`,
    beginAtZero: true,
    series: [
      { label: `${what} required`, role: 'line', axis: 'y', points: required },
      { label: `${what} available`, role: 'line2', axis: 'y', points: available },
      ...marks,
    ],
  };
}

/**
 * Payload against range for the plan's range mission (its loiters left out, cruise flown
 * until the reserve), with the plan's own payload as a horizontal reference.
 */
export function payloadRangeChart(
  points: readonly PayloadRangePoint[],
  plan: Plan,
  system: UnitSystem,
): ChartSpec {
  const xy = points.map((p) => ({
    x: displayValue(p.range_m, 'distance', system, { decimals: 2 }),
    y: displayValue(p.payload_kg, 'mass', system, { decimals: 2 }),
  }));
  const right = Math.max(0, ...xy.map((p) => p.x));
  return {
    xTitle: `Range (${label('distance', system)})`,
    yTitle: `Payload (${label('mass', system)})`,
    beginAtZero: true,
    xFromZero: true,
    series: [
      { label: 'Payload–range', role: 'line', axis: 'y', points: xy },
      { label: 'Range at each payload', role: 'points', axis: 'y', points: xy },
      horizontalMark(
        'Payload of this plan',
        displayValue(plan.aircraft.mass.payload_kg, 'mass', system, { decimals: 2 }),
        0,
        right,
      ),
    ],
  };
}
