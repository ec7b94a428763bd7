/**
 * Writes a planned route as GPX 1.1 (TopoGrafix, topografix.com/GPX/1/1): one `rte` with a
 * `rtept` per waypoint, element order as the schema's wptType and rteType require. The plan's
 * estimates ride in `extensions` under our own namespace (the schema allows any namespace
 * there): `lw:id`, `lw:eta_s` (time from departure, s) and `lw:fuel_kg` or `lw:energy_J`
 * (what is left on arrival). No clock time is written: the core does not know the
 * departure time. Magnetic variation goes to `magvar` as 0 ≤ v < 360 (west = 360 − |v|).
 */
import { InputError, requireFinite } from '../errors.ts';
import { normalizeCourse } from './geodesic.ts';
import { checkWaypoint, type Waypoint } from './waypoints.ts';
import { escapeXml, xsdDecimal } from './xmlText.ts';

export const GPX_NS = 'http://www.topografix.com/GPX/1/1';
export const LEGWISE_GPX_NS = 'https://legwise.invalid/gpx/1';

export interface WaypointEstimate {
  /** Estimated time from departure at the waypoint, s. */
  eta_s: number;
  /** Fuel (kg) or battery energy (J) left at the waypoint; negative when short. */
  remaining: number;
  remainingUnit: 'kg' | 'J';
}

export interface GpxMeta {
  /** The `creator` attribute GPX 1.1 requires (default `Legwise`). */
  creator?: string;
  /** Free text for `metadata/desc`, e.g. the plan's name and a planning caution. */
  description?: string;
}

/**
 * GPX 1.1 text for a route; `perWaypoint` has one estimate per waypoint, or is empty for
 * the route alone. Throws InputError for a bad waypoint or estimate.
 */
export function writeGpx(
  route: { name: string; waypoints: readonly Waypoint[] },
  perWaypoint: readonly WaypointEstimate[],
  meta: GpxMeta = {},
): string {
  const n = route.waypoints.length;
  if (perWaypoint.length !== 0 && perWaypoint.length !== n) {
    throw new InputError(
      'perWaypoint',
      `${perWaypoint.length} estimates`,
      `one per waypoint (${n}) or none`,
    );
  }
  const out: string[] = [
    '<?xml version="1.0" encoding="UTF-8"?>',
    `<gpx version="1.1" creator="${escapeXml(meta.creator ?? 'Legwise')}" xmlns="${GPX_NS}" xmlns:lw="${LEGWISE_GPX_NS}">`,
    '  <metadata>',
    `    <name>${escapeXml(route.name)}</name>`,
  ];
  if (meta.description) out.push(`    <desc>${escapeXml(meta.description)}</desc>`);
  out.push('  </metadata>', '  <rte>', `    <name>${escapeXml(route.name)}</name>`);
  route.waypoints.forEach((w, i) => {
    checkWaypoint(w, `route.waypoints.${i}`);
    out.push(...routePoint(w, perWaypoint[i], i));
  });
  out.push('  </rte>', '</gpx>', '');
  return out.join('\n');
}

function routePoint(w: Waypoint, est: WaypointEstimate | undefined, i: number): string[] {
  const lines = [`    <rtept lat="${xsdDecimal(w.lat_deg)}" lon="${xsdDecimal(w.lon_deg)}">`];
  if (w.altitude_m !== undefined) lines.push(`      <ele>${xsdDecimal(w.altitude_m)}</ele>`);
  if (w.magneticVariation_deg !== undefined) {
    const magvar = normalizeCourse(w.magneticVariation_deg);
    lines.push(`      <magvar>${xsdDecimal(magvar)}</magvar>`);
  }
  lines.push(`      <name>${escapeXml(w.name)}</name>`, '      <extensions>');
  lines.push(`        <lw:id>${escapeXml(w.id)}</lw:id>`);
  if (est) {
    const field = `perWaypoint.${i}`;
    requireFinite(`${field}.eta_s`, est.eta_s, 0, Infinity, 's');
    requireFinite(`${field}.remaining`, est.remaining, -Infinity, Infinity, est.remainingUnit);
    if (est.remainingUnit !== 'kg' && est.remainingUnit !== 'J') {
      throw new InputError(`${field}.remainingUnit`, est.remainingUnit, "'kg' or 'J'");
    }
    const tag = est.remainingUnit === 'kg' ? 'lw:fuel_kg' : 'lw:energy_J';
    lines.push(`        <lw:eta_s>${xsdDecimal(est.eta_s)}</lw:eta_s>`);
    lines.push(`        <${tag}>${xsdDecimal(est.remaining)}</${tag}>`);
  }
  lines.push('      </extensions>', '    </rtept>');
  return lines;
}
