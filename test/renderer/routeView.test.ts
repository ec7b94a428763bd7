import { describe, expect, it } from 'vitest';
import type { Plan } from '../../core/plan/schema.ts';
import { solvePlan } from '../../core/solver/solve.ts';
import {
  legState,
  niceLength,
  runState,
  projectRoute,
  routeView,
} from '../../renderer/src/support/routeView.ts';
import { buildRouteLegs, legTargets, withWaypoints } from '../../renderer/src/support/routeOps.ts';
import { placeTexts } from '../../renderer/src/support/labelPlacement.ts';
import { examplePlan } from './fixtures.ts';
import { runsPlan } from './routePlans.ts';

// IUGG mean Earth radius R1 = 6 371 008.8 m (Moritz, "Geodetic Reference System 1980");
// one degree of arc on it is R1·π/180 = 111 195.08 m.
const DEGREE_M = (6371008.8 * Math.PI) / 180;

describe('route view', () => {
  it('projects around the centre: a degree of latitude is R·π/180, longitude shrinks by cos φ', () => {
    const xy = projectRoute([
      { id: 'a', name: '', lat_deg: 0, lon_deg: 10 },
      { id: 'b', name: '', lat_deg: 1, lon_deg: 10 },
    ]);
    expect((xy[1]?.y ?? 0) - (xy[0]?.y ?? 0)).toBeCloseTo(DEGREE_M, 6);
    const east = projectRoute([
      { id: 'a', name: '', lat_deg: 60, lon_deg: 0 },
      { id: 'b', name: '', lat_deg: 60, lon_deg: 1 },
    ]);
    // cos 60° = 0.5 exactly.
    expect((east[1]?.x ?? 0) - (east[0]?.x ?? 0)).toBeCloseTo(DEGREE_M * 0.5, 6);
    // Across the antimeridian the short way round (179.5° E to 179.5° W is 1° of longitude).
    const wrap = projectRoute([
      { id: 'a', name: '', lat_deg: 0, lon_deg: 179.5 },
      { id: 'b', name: '', lat_deg: 0, lon_deg: -179.5 },
    ]);
    expect((wrap[1]?.x ?? 0) - (wrap[0]?.x ?? 0)).toBeCloseTo(DEGREE_M, 6);
  });

  it('picks a round scale-bar length (1, 2 or 5 × 10ⁿ)', () => {
    // Rounding rule of the scale bar (common practice for map scales).
    expect(niceLength(37)).toBe(20);
    expect(niceLength(7.2)).toBe(5);
    expect(niceLength(0.13)).toBeCloseTo(0.1, 12);
    expect(niceLength(1000)).toBe(1000);
  });

  it('draws each leg that flies to a waypoint with the state of its checks', () => {
    const base = examplePlan('twelve-legs');
    const plan: Plan = buildRouteLegs(
      withWaypoints(base, [
        { id: 'p', name: 'P', lat_deg: 47, lon_deg: 8 },
        { id: 'q', name: 'Q', lat_deg: 47.3, lon_deg: 8.4 },
        { id: 'r', name: 'R', lat_deg: 47.1, lon_deg: 8.9 },
      ]),
      { replace: true },
    );
    const result = solvePlan(plan, { samplesPerLeg: 2 });
    const targets = legTargets(plan);
    expect(targets.problem).toBeNull();
    const view = routeView(plan, targets.targets, result, 'aviation', {
      width: 400,
      height: 230,
      pad: 30,
    });
    expect(view?.points.map((p) => p.label)).toEqual(['1 P', '2 Q', '3 R']);
    // Three waypoints, two legs built to them.
    expect(view?.segments).toHaveLength(2);
    for (const s of view?.segments ?? []) {
      expect(s.legIndices).toHaveLength(1);
      expect(s.state).toBe(legState(result, s.legIndices[0] ?? -1));
    }
    expect(view?.scaleBar.label).toMatch(/^\d+(\.\d+)? NM$/);
    // Everything inside the 400 × 230 frame asked for.
    for (const p of view?.points ?? []) {
      expect(p.x).toBeGreaterThanOrEqual(0);
      expect(p.x).toBeLessThanOrEqual(400);
      expect(p.y).toBeGreaterThanOrEqual(0);
      expect(p.y).toBeLessThanOrEqual(230);
    }
  });

  it('a run of a climb, a cruise and a descent to one waypoint is one segment', () => {
    // routePlans.ts: climb, cruise and descent to the second waypoint; two cruises and a descent to the third.
    const plan = runsPlan();
    const result = solvePlan(plan, { samplesPerLeg: 2 });
    const view = routeView(plan, legTargets(plan).targets, result, 'si', {
      width: 400,
      height: 230,
      pad: 30,
    });
    const runs = view?.segments.map((s) => s.legIndices.length) ?? [];
    expect(runs).toEqual([3, 3]);
    expect(view?.segments.length).toBe((plan.route?.waypoints.length ?? 0) - 1);
    const first = view?.segments[0];
    const states = (first?.legIndices ?? []).map((i) => legState(result, i));
    // The worst of the run's legs, in the order fails, tight, ok.
    const worst = states.includes('fails') ? 'fails' : states.includes('tight') ? 'tight' : 'ok';
    expect(first?.state).toBe(worst);
  });

  it('a leg that fails is drawn as failing, one after it as not reached', () => {
    const plan = examplePlan('twelve-legs');
    const result = solvePlan(plan, { samplesPerLeg: 2 });
    const broken = {
      ...result,
      legs: result.legs.map((l, i) =>
        i === 2
          ? { ...l, status: 'failed' as const }
          : i > 2
            ? { ...l, status: 'notReached' as const }
            : l,
      ),
    };
    expect(legState(broken, 2)).toBe('fails');
    expect(legState(broken, 3)).toBe('notReached');
    expect(legState(null, 0)).toBe('notReached');
    // A run takes the worst of its legs; not reached only when none was flown.
    expect(runState(broken, [1, 2])).toBe('fails');
    expect(runState(broken, [3, 4])).toBe('notReached');
  });

  it('places waypoint names so that two close points do not write over each other', () => {
    const points = [
      { x: 100, y: 100, text: '1 Alpha field' },
      { x: 104, y: 103, text: '2 Bravo' },
    ];
    const { labels } = placeTexts(points, [], { width: 400, height: 230 });
    // Same corner would put both baselines within one 13-unit line of text of each other.
    const [a, b] = labels;
    const sameCorner = a?.anchor === b?.anchor && Math.abs((a?.y ?? 0) - (b?.y ?? 0)) < 13;
    expect(sameCorner).toBe(false);
  });
});
