/**
 * Sanity warnings: inputs that are valid but outside the values common practice sees for the
 * aircraft's class (REFERENCES.md, "Sanity ranges for inputs"; TSFC classes after Raymer,
 * from memory). A warning never blocks solving. Weight above MTOW and fuel above the tank are
 * not warnings here: the solver reports them as failed checks.
 */
import { fromSI, WH } from '../units.ts';
import type { JetPowerplant, Plan } from './schema.ts';

/** Common practice: small UAVs are the aircraft up to 150 kg MTOW (from memory). */
export const SMALL_UAV_MAX_MTOW_KG = 150;

interface Range {
  min: number;
  max: number;
  /** How the range is named in the message, e.g. `for light aircraft`. */
  what: string;
}

function show(v: number): string {
  return String(Number(v.toPrecision(3)));
}

function check(out: string[], field: string, value: number, r: Range, unit = ''): void {
  if (value >= r.min && value <= r.max) return;
  const u = unit ? ` ${unit}` : '';
  const side = value < r.min ? 'below' : 'above';
  out.push(
    `${field}: ${show(value)}${u} is ${side} the common range ${r.what} ` +
      `(${show(r.min)}–${show(r.max)}${u}, common practice)`,
  );
}

type AircraftClass = 'jet' | 'lightAircraft' | 'smallUav';

function aircraftClass(plan: Plan): AircraftClass {
  if (plan.aircraft.powerplant.type === 'jet') return 'jet';
  return plan.aircraft.mass.mtow_kg <= SMALL_UAV_MAX_MTOW_KG ? 'smallUav' : 'lightAircraft';
}

const CD0_RANGE: Record<AircraftClass, Range> = {
  jet: { min: 0.015, max: 0.025, what: 'for jets' },
  lightAircraft: { min: 0.025, max: 0.04, what: 'for light aircraft' },
  smallUav: { min: 0.02, max: 0.06, what: 'for small UAVs' },
};

const PROP_EFFICIENCY: Record<'lightAircraft' | 'smallUav', Range> = {
  lightAircraft: { min: 0.75, max: 0.88, what: 'for cruise propellers' },
  smallUav: { min: 0.5, max: 0.8, what: 'for small UAV propellers' },
};

function polarWarnings(plan: Plan, cls: AircraftClass, out: string[]): void {
  const { polar } = plan.aircraft;
  check(out, 'aircraft.polar.CD0', polar.CD0, CD0_RANGE[cls]);
  if (polar.induced.by === 'geometry') {
    check(out, 'aircraft.polar.induced.e', polar.induced.e, {
      min: 0.7,
      max: 0.9,
      what: 'for Oswald efficiency',
    });
    check(out, 'aircraft.polar.induced.AR', polar.induced.AR, {
      min: 5,
      max: 12,
      what: 'for powered aircraft (sailplanes reach about 40)',
    });
  }
  const span = plan.aircraft.span_m;
  if (span !== undefined && polar.induced.by === 'geometry') {
    // AR = b²/S (definition); a span far from it makes the Reynolds number's chord doubtful.
    const ar = (span * span) / plan.aircraft.wingArea_m2;
    if (Math.abs(ar - polar.induced.AR) > 0.1 * polar.induced.AR) {
      out.push(
        `aircraft.span_m: ${show(span)} m gives an aspect ratio b²/S of ${show(ar)}, ` +
          `not the polar's ${show(polar.induced.AR)} (aircraft.polar.induced.AR)`,
      );
    }
  }
  if (polar.CLmaxFlaps !== undefined && polar.CLmaxFlaps < polar.CLmax) {
    out.push(
      `aircraft.polar.CLmaxFlaps: ${show(polar.CLmaxFlaps)} is below CLmax (${show(polar.CLmax)}); ` +
        'flaps normally raise the maximum lift coefficient',
    );
  }
}

function powerplantWarnings(plan: Plan, cls: AircraftClass, out: string[]): void {
  const pp = plan.aircraft.powerplant;
  const at = 'aircraft.powerplant';
  if (pp.type === 'jet') {
    jetWarnings(pp, at, out);
  } else if (pp.type === 'propeller') {
    const bsfc = fromSI(pp.bsfc_kg_J, 'lb_hph');
    const range =
      pp.engine === 'piston'
        ? { min: 0.4, max: 0.55, what: 'for piston engines' }
        : { min: 0.45, max: 0.65, what: 'for turboprops' };
    check(out, `${at}.bsfc_kg_J`, bsfc, range, 'lb/(hp·h)');
    check(
      out,
      `${at}.propEfficiency`,
      pp.propEfficiency,
      PROP_EFFICIENCY[cls === 'smallUav' ? 'smallUav' : 'lightAircraft'],
    );
  } else {
    const b = pp.battery;
    check(
      out,
      `${at}.propEfficiency`,
      pp.propEfficiency,
      PROP_EFFICIENCY[cls === 'smallUav' ? 'smallUav' : 'lightAircraft'],
    );
    // Motor × controller × propeller: the whole chain from battery to thrust power.
    const chain = pp.motorEfficiency * pp.controllerEfficiency * pp.propEfficiency;
    check(out, `${at} drivetrain efficiency (motor × controller × propeller)`, chain, {
      min: 0.5,
      max: 0.8,
      what: 'for electric drivetrains',
    });
    check(
      out,
      `${at}.battery (energy_J / mass_kg)`,
      b.energy_J / WH / b.mass_kg,
      {
        min: 100,
        max: 220,
        what: 'for Li-ion packs (cells 150–300 Wh/kg)',
      },
      'Wh/kg',
    );
    check(out, `${at}.battery.peukertExponent`, b.peukertExponent, {
      min: 1,
      max: 1.1,
      what: 'for Li-ion (lead-acid 1.1–1.3)',
    });
  }
}

/** A leg set to the mission wind in a plan without one flies its own wind: say so. */
function windWarnings(plan: Plan, out: string[]): void {
  const mw = plan.environment.missionWind;
  plan.legs.forEach((l, i) => {
    if (!('wind' in l)) return;
    const source = l.windSource ?? (mw ? 'mission' : 'leg');
    if (source === 'mission' && mw === undefined) {
      out.push(
        `legs.${i}.windSource: 'mission' but the plan has no mission wind; the leg flies its own wind`,
      );
    }
  });
}

/** ISA at 11 000 m, M 0.8: where a Mach-and-θ TSFC is compared with cruise values. */
const CRUISE_CHECK_THETA = 216.65 / 288.15;
const CRUISE_CHECK_MACH = 0.8;

function jetWarnings(pp: JetPowerplant, at: string, out: string[]): void {
  const varying = pp.tsfcMachFactor !== undefined;
  const cruise = varying
    ? pp.tsfc_kg_Ns *
      (1 + (pp.tsfcMachFactor ?? 0) * CRUISE_CHECK_MACH) *
      Math.sqrt(CRUISE_CHECK_THETA)
    : pp.tsfc_kg_Ns;
  check(
    out,
    varying ? `${at}.tsfc_kg_Ns (TSFC at M 0.8, 11 000 m ISA)` : `${at}.tsfc_kg_Ns`,
    fromSI(cruise, 'lb_lbfh'),
    {
      min: 0.5,
      max: 1.1,
      what: 'from high-bypass turbofans (0.5–0.65) to turbojets (0.9–1.1)',
    },
    'lb/(lbf·h)',
  );
  // σ^n standing in for a Mach lapse: n ≈ 0.7 for a turbojet up to ≈ 1.4 for a high-bypass
  // fan at cruise Mach (1.40 matches Mattingly's high-bypass lapse at 35 000 ft, M 0.72).
  if (pp.thrustLapse === undefined && pp.thrustLapseExponent !== undefined) {
    check(out, `${at}.thrustLapseExponent`, pp.thrustLapseExponent, {
      min: 0.7,
      max: 1.5,
      what: 'for the density exponent of thrust lapse',
    });
  }
}

/** Plain-language warnings, each naming the field and the common range. */
export function planWarnings(plan: Plan): string[] {
  const out: string[] = [];
  const cls = aircraftClass(plan);
  polarWarnings(plan, cls, out);
  powerplantWarnings(plan, cls, out);
  windWarnings(plan, out);
  return out;
}
