import { describe, expect, it } from 'vitest';
import { solvePlan } from '../../core/solver/solve.ts';
import { powerCurves } from '../../core/optimize/curves.ts';
import { dragCoefficient, polarCoefficients } from '../../core/polar.ts';
import { polarChart, powerChart, profileChart } from '../../renderer/src/support/chartData.ts';
import { pointCount } from '../../renderer/src/support/chartSpec.ts';
import { examplePlan } from './fixtures.ts';

describe('chart data', () => {
  const plan = examplePlan('twelve-legs');
  const result = solvePlan(plan, { samplesPerLeg: 12 });

  it('profile: one point per sample of every flown leg, altitude in the display unit', () => {
    const si = profileChart(result, 'distance', 'si');
    const samples = result.legs.reduce((n, l) => n + l.series.t_s.length, 0);
    expect(si.series[0]?.points).toHaveLength(samples);
    const ft = profileChart(result, 'distance', 'aviation');
    const top = Math.max(...result.legs.flatMap((l) => l.series.h_m));
    // ft = 0.3048 m exactly (NIST SP 811); display rounding to 0.1 ft.
    expect(Math.max(...(ft.series[0]?.points ?? []).map((p) => p.y))).toBeCloseTo(top / 0.3048, 1);
    expect(ft.xTitle).toContain('NM');
    const byTime = profileChart(result, 'time', 'si');
    // Time axis in minutes: total time / 60 (exact).
    expect(byTime.series[0]?.points.at(-1)?.x).toBeCloseTo(result.totals.time_s / 60, 2);
  });

  it('polar: the curve follows the plan polar and every flown leg is marked', () => {
    const spec = polarChart(plan, result);
    const c = polarCoefficients(plan.aircraft.polar);
    const curve = spec.series[0]?.points ?? [];
    for (const p of curve) expect(p.y).toBeCloseTo(dragCoefficient(c, p.x), 12); // CD = CD0 + k(CL − CLminD)², Anderson ch. 6
    const flying = result.legs.filter((l) => l.status !== 'notReached' && l.CL.max > 0).length;
    expect(spec.series[2]?.points.length).toBeGreaterThanOrEqual(flying);
  });

  it('power: required and available have a point at every swept speed, plus the marks', () => {
    const cruise = plan.legs.findIndex((l) => l.kind === 'cruise');
    const curves = powerCurves(plan, cruise);
    const spec = powerChart(curves, 'power', 'aviation');
    expect(spec.series[0]?.points).toHaveLength(curves.tas_m_s.length);
    expect(spec.series[1]?.points).toHaveLength(curves.tas_m_s.length);
    expect(spec.series.filter((s) => s.role === 'mark').length).toBeGreaterThanOrEqual(3);
    expect(pointCount(spec)).toBeGreaterThan(2 * curves.tas_m_s.length);
    expect(spec.yTitle).toContain('hp');
  });
});
