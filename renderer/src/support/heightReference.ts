/**
 * Heights above the launch point (issue 11): altitude boxes of the route and the legs may
 * show and take heights above the departure field (AGL = altitude MSL − departure
 * elevation, common practice for UAV operators) instead of altitudes above mean sea level.
 * The plan always stores the altitude above MSL in metres; only what the box shows and
 * reads is shifted by the departure elevation. Flight levels are pressure levels and are
 * never shifted; field elevations are always MSL.
 */

export type AltitudeReference = 'msl' | 'agl';

/** Where an altitude box's value is measured from. */
export type AltitudeDatum = 'launch' | 'msl';

export function isAltitudeReference(value: unknown): value is AltitudeReference {
  return value === 'msl' || value === 'agl';
}

/** The reference named beside a box of `datum`: launch boxes follow the setting. */
export function referenceOf(datum: AltitudeDatum, chosen: AltitudeReference): AltitudeReference {
  return datum === 'launch' ? chosen : 'msl';
}

/** "ft AGL", "m MSL": the unit label with the reference beside it. */
export function referencedLabel(unitLabel: string, reference: AltitudeReference): string {
  return `${unitLabel} ${reference.toUpperCase()}`;
}

/** The metres a box subtracts from the stored altitude (0 for MSL). */
export function referenceOffset_m(
  reference: AltitudeReference,
  departureElevation_m: number,
): number {
  return reference === 'agl' ? departureElevation_m : 0;
}

/** Stored altitude MSL (m) → the height the box shows, in metres above the reference. */
export function shownHeight_m(altitudeMsl_m: number, offset_m: number): number {
  return altitudeMsl_m - offset_m;
}

/** A height typed above the reference (m) → the altitude MSL the plan stores. */
export function storedAltitude_m(shown_m: number, offset_m: number): number {
  return shown_m + offset_m;
}
