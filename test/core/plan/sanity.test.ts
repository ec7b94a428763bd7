/**
 * Sanity warnings against the common-practice ranges listed in REFERENCES.md ("Sanity ranges
 * for inputs"); unit conversions for TSFC and BSFC use the exact definitions of NIST SP 811.
 */
import { describe, expect, it } from 'vitest';
import { parsePlan } from '../../../core/plan/load.ts';
import type { Plan } from '../../../core/plan/schema.ts';
import { planWarnings } from '../../../core/plan/sanity.ts';
import { demoJson, setAt } from './demoPlans.ts';

function plan(file: string, edits: Record<string, unknown> = {}): Plan {
  const data = demoJson(file);
  for (const [path, value] of Object.entries(edits)) setAt(data, path, value);
  const r = parsePlan(data);
  if (!r.ok) throw new Error(JSON.stringify(r.issues));
  return r.plan;
}

const JET = 'light-jet.json';
const PISTON = 'piston-tourer.json';
const UAV = 'survey-uav-electric.json';
const LB_LBFH = 0.45359237 / (4.4482216152605 * 3600); // kg/(N·s) per lb/(lbf·h), NIST SP 811 exact factors
const LB_HPH = 0.45359237 / (745.69987158227 * 3600); // kg/J per lb/(hp·h), NIST SP 811 exact factors

function warningFor(p: Plan, field: string): string | undefined {
  return planWarnings(p).find((w) => w.startsWith(`${field}: `));
}

describe('planWarnings', () => {
  it('is silent for values inside the common ranges (the demo plans)', () => {
    for (const f of [JET, PISTON, UAV, 'twelve-legs.json'])
      expect(planWarnings(plan(f))).toEqual([]);
  });

  it('CD0 by aircraft class', () => {
    // jets 0.015–0.025, light aircraft 0.025–0.04, small UAVs 0.02–0.06 (common practice)
    expect(warningFor(plan(JET, { 'aircraft.polar.CD0': 0.012 }), 'aircraft.polar.CD0')).toBe(
      'aircraft.polar.CD0: 0.012 is below the common range for jets (0.015–0.025, common practice)',
    );
    expect(
      warningFor(plan(PISTON, { 'aircraft.polar.CD0': 0.05 }), 'aircraft.polar.CD0'),
    ).toContain('above the common range for light aircraft (0.025–0.04');
    expect(
      warningFor(plan(UAV, { 'aircraft.polar.CD0': 0.05 }), 'aircraft.polar.CD0'),
    ).toBeUndefined();
    expect(warningFor(plan(UAV, { 'aircraft.polar.CD0': 0.07 }), 'aircraft.polar.CD0')).toContain(
      'for small UAVs (0.02–0.06',
    );
  });

  it('Oswald efficiency 0.7–0.9 and aspect ratio 5–12 (common practice)', () => {
    expect(
      warningFor(plan(PISTON, { 'aircraft.polar.induced.e': 0.6 }), 'aircraft.polar.induced.e'),
    ).toContain('0.7–0.9');
    expect(
      warningFor(plan(PISTON, { 'aircraft.polar.induced.AR': 25 }), 'aircraft.polar.induced.AR'),
    ).toContain(
      '25 is above the common range for powered aircraft (sailplanes reach about 40) (5–12',
    );
    // a given induced-drag factor has no e or AR to judge
    expect(
      planWarnings(plan(PISTON, { 'aircraft.polar.induced': { by: 'factor', k: 0.05 } })),
    ).toEqual([]);
  });

  it('TSFC in lb/(lbf·h): 0.5–1.1 from high-bypass to turbojet (Raymer, from memory)', () => {
    // A constant TSFC (no Mach factor) is judged as it is.
    const constant = { 'aircraft.powerplant.tsfcMachFactor': undefined };
    const low = plan(JET, { ...constant, 'aircraft.powerplant.tsfc_kg_Ns': 0.4 * LB_LBFH });
    expect(warningFor(low, 'aircraft.powerplant.tsfc_kg_Ns')).toMatch(
      /: 0\.4 lb\/\(lbf·h\) is below .*\(0\.5–1\.1 lb\/\(lbf·h\)/,
    );
    expect(
      warningFor(
        plan(JET, { ...constant, 'aircraft.powerplant.tsfc_kg_Ns': 0.6 * LB_LBFH }),
        'aircraft.powerplant.tsfc_kg_Ns',
      ),
    ).toBeUndefined();
    expect(
      warningFor(
        plan(JET, { ...constant, 'aircraft.powerplant.tsfc_kg_Ns': 1.3 * LB_LBFH }),
        'aircraft.powerplant.tsfc_kg_Ns',
      ),
    ).toContain('1.3 lb/(lbf·h) is above');
  });

  it('a TSFC that varies with Mach and θ is judged at M 0.8, 11 000 m ISA (cruise values)', () => {
    // Mattingly's high-bypass c₁ 0.45 lb/(lbf·h), c₂/c₁ 1.2 (from memory): at M 0.8 and
    // √θ = √(216.65/288.15) the TSFC is 0.45·1.96·0.86711 = 0.7648 (hand evaluation), above
    // Raymer's 0.5–0.65 for high bypass but inside the 0.5–1.1 span; c₁ 0.2 gives 0.34.
    const field = 'aircraft.powerplant.tsfc_kg_Ns (TSFC at M 0.8, 11 000 m ISA)';
    const at = (c1: number) =>
      warningFor(plan(JET, { 'aircraft.powerplant.tsfc_kg_Ns': c1 * LB_LBFH }), field);
    expect(at(0.45)).toBeUndefined();
    expect(at(0.2)).toContain('0.34 lb/(lbf·h) is below');
  });

  it('thrust lapse exponent: 0.7–1.5, so σ^1.4 (Mattingly high bypass at FL350, M 0.72) passes', () => {
    // σ(35 000 ft) = 0.309875 and α = 0.19416 (REFERENCES.md): n = ln α / ln σ = 1.399.
    const density = (n: number) =>
      plan(JET, {
        'aircraft.powerplant.thrustLapse': undefined,
        'aircraft.powerplant.thrustLapseExponent': n,
      });
    const field = 'aircraft.powerplant.thrustLapseExponent';
    expect(warningFor(density(1.4), field)).toBeUndefined();
    expect(warningFor(density(0.8), field)).toBeUndefined();
    expect(warningFor(density(1.8), field)).toContain('is above');
    expect(warningFor(density(0.5), field)).toContain('is below');
  });

  it('BSFC in lb/(hp·h): piston 0.40–0.55, turboprop 0.45–0.65 (common practice)', () => {
    const field = 'aircraft.powerplant.bsfc_kg_J';
    expect(warningFor(plan(PISTON, { [field]: 0.6 * LB_HPH }), field)).toContain(
      '0.6 lb/(hp·h) is above the common range for piston engines (0.4–0.55',
    );
    const turboprop = { 'aircraft.powerplant.engine': 'turboprop', [field]: 0.6 * LB_HPH };
    expect(warningFor(plan(PISTON, turboprop), field)).toBeUndefined();
  });

  it('propeller efficiency: 0.75–0.88 cruise, 0.5–0.8 small UAV (common practice)', () => {
    const field = 'aircraft.powerplant.propEfficiency';
    expect(warningFor(plan(PISTON, { [field]: 0.65 }), field)).toContain(
      'for cruise propellers (0.75–0.88',
    );
    expect(warningFor(plan(UAV, { [field]: 0.65 }), field)).toBeUndefined();
    expect(
      warningFor(plan(UAV, { [field]: 0.85, 'aircraft.powerplant.motorEfficiency': 0.8 }), field),
    ).toContain('for small UAV propellers (0.5–0.8');
  });

  it('battery: pack 100–220 Wh/kg, drivetrain 0.5–0.8, Peukert 1.0–1.1 for Li-ion (common practice)', () => {
    const pack = plan(UAV, { 'aircraft.powerplant.battery.energy_J': 300 * 3600 * 3.4 }); // 300 Wh/kg; 1 Wh = 3600 J (exact)
    expect(planWarnings(pack).join('\n')).toContain(
      'battery (energy_J / mass_kg): 300 Wh/kg is above the common range for Li-ion packs',
    );
    const chain = plan(UAV, { 'aircraft.powerplant.motorEfficiency': 0.7 }); // 0.7·0.96·0.72 = 0.484
    expect(planWarnings(chain).join('\n')).toContain(
      'drivetrain efficiency (motor × controller × propeller): 0.484 is below',
    );
    const peukert = plan(UAV, { 'aircraft.powerplant.battery.peukertExponent': 1.25 });
    expect(warningFor(peukert, 'aircraft.powerplant.battery.peukertExponent')).toContain(
      '(lead-acid 1.1–1.3) (1–1.1',
    );
  });

  it('a span that does not match the aspect ratio (AR = b²/S, definition)', () => {
    const p = plan(PISTON);
    const S = p.aircraft.wingArea_m2;
    const AR = p.aircraft.polar.induced.by === 'geometry' ? p.aircraft.polar.induced.AR : 0;
    const matching = Math.sqrt(AR * S);
    expect(warningFor(plan(PISTON, { 'aircraft.span_m': matching }), 'aircraft.span_m')).toBe(
      undefined,
    );
    const off = warningFor(plan(PISTON, { 'aircraft.span_m': 1.5 * matching }), 'aircraft.span_m');
    expect(off).toContain(`not the polar's`);
  });

  it('does not warn for weight above MTOW or fuel above the tank (those are solver checks)', () => {
    const heavy = plan(PISTON, {
      'aircraft.mass.payload_kg': 900,
      'aircraft.powerplant.fuel.load_kg': 400,
    });
    expect(planWarnings(heavy)).toEqual([]);
  });
});
