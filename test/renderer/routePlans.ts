/**
 * A plan whose legs fly in runs to route waypoints, built from the twelve-leg demo: a climb,
 * a cruise and a descent to the second waypoint, then two cruises and a descent to the third.
 */
import type { Leg, Plan } from '../../core/plan/schema.ts';
import { examplePlan } from './fixtures.ts';

const TARGETS: Record<number, string> = { 1: 'q', 2: 'q', 3: 'q', 8: 'r', 9: 'r', 10: 'r' };

export function runsPlan(): Plan {
  const base = examplePlan('twelve-legs');
  const legs = base.legs.map((leg, i): Leg => {
    const to = TARGETS[i];
    return to && 'wind' in leg ? { ...leg, toWaypoint: to } : leg;
  });
  return {
    ...base,
    route: {
      magneticVariation_deg: 0,
      waypoints: [
        { id: 'p', name: 'P', lat_deg: 47, lon_deg: 8 },
        { id: 'q', name: 'Q', lat_deg: 47.35, lon_deg: 8.45 },
        { id: 'r', name: 'R', lat_deg: 46.6, lon_deg: 9.9 },
      ],
    },
    legs,
  };
}
