/**
 * Runway surfaces: rolling friction μ (wheels free, take-off and free roll) and braking
 * friction μ_brake (wheels braked, landing roll).
 *
 * Values are common practice, taken from memory from the table of rolling-resistance
 * coefficients in Raymer, Aircraft Design: A Conceptual Approach, ch. 17 (dry concrete or
 * asphalt 0.03–0.05 rolling, 0.3–0.5 braked; wet 0.05 / 0.15–0.3; hard turf 0.05 / 0.4;
 * soft turf 0.07 / 0.2; wet grass 0.08 / 0.2); short dry grass takes the hard-turf rolling
 * value with braking a little below it (0.35). Long grass and soft ground are not in that
 * table; their values here are common-practice estimates (from memory) chosen so that the
 * roll grows the way light-aircraft operating guidance says it does on those surfaces. They
 * are planning figures, not measured values: a surface object with its own μ overrides them.
 */
import { InputError, requireFinite } from '../errors.ts';

export type SurfaceId = 'dryHard' | 'wetHard' | 'shortDryGrass' | 'longGrass' | 'softGround';

export interface SurfaceFriction {
  /** Rolling friction coefficient, brakes off. */
  muRoll: number;
  /** Effective friction coefficient with the brakes applied. */
  muBrake: number;
}

export interface SurfaceInfo extends SurfaceFriction {
  label: string;
  /** Where the numbers come from, for the screen and the report. */
  source: string;
}

const RAYMER = 'Raymer, Aircraft Design, ch. 17 (common practice, from memory)';
const ESTIMATE = 'common-practice estimate (from memory)';

export const SURFACES: Readonly<Record<SurfaceId, SurfaceInfo>> = {
  dryHard: { label: 'Dry concrete or asphalt', muRoll: 0.04, muBrake: 0.4, source: RAYMER },
  wetHard: { label: 'Wet hard surface', muRoll: 0.05, muBrake: 0.2, source: RAYMER },
  shortDryGrass: { label: 'Short dry grass', muRoll: 0.05, muBrake: 0.35, source: RAYMER },
  longGrass: { label: 'Long grass', muRoll: 0.1, muBrake: 0.25, source: ESTIMATE },
  softGround: { label: 'Soft ground', muRoll: 0.12, muBrake: 0.2, source: ESTIMATE },
};

export const SURFACE_IDS = Object.keys(SURFACES) as readonly SurfaceId[];

export function isSurfaceId(id: string): id is SurfaceId {
  return Object.prototype.hasOwnProperty.call(SURFACES, id);
}

/**
 * Friction of a named surface, or of a surface given by its own coefficients (checked:
 * 0 ≤ μ ≤ 1, which covers every runway surface with room to spare).
 */
export function surfaceFriction(
  surface: SurfaceId | SurfaceFriction,
  field = 'surface',
): SurfaceFriction {
  if (typeof surface === 'string') {
    if (!isSurfaceId(surface))
      throw new InputError(field, surface, `one of ${SURFACE_IDS.join(', ')}`);
    const { muRoll, muBrake } = SURFACES[surface];
    return { muRoll, muBrake };
  }
  return {
    muRoll: requireFinite(`${field}.muRoll`, surface.muRoll, 0, 1),
    muBrake: requireFinite(`${field}.muBrake`, surface.muBrake, 0, 1),
  };
}
