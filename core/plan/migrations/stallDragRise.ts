/**
 * Migration part (schema 1 → 2): the drag polar no longer holds its parabola up to CLmax.
 * Old plans get the stall drag rise of core/polar.ts with an onset at 0.8·CLmax and a rise of
 * CD0 at CLmax (our default, from memory: measured polars bend away over the last 15–25 % of
 * CL before the stall). Below the onset — every speed above 1.12·V_s, so every speed the
 * usual 1.2·V_s margin allows — the polar is unchanged, and so is the old design point.
 */
import type { MigrationPart } from './v1to2.ts';

function isRecord(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

export const stallDragRisePart: MigrationPart = (raw, notes) => {
  const ac = raw.aircraft;
  if (!isRecord(ac) || !isRecord(ac.polar)) return raw;
  const polar = ac.polar;
  if (polar.stallDragRise !== undefined) return raw;
  const CLmax = polar.CLmax;
  const CD0 = polar.CD0;
  if (typeof CLmax !== 'number' || !Number.isFinite(CLmax) || !(CLmax > 0)) return raw;
  if (typeof CD0 !== 'number' || !Number.isFinite(CD0) || !(CD0 > 0)) return raw;
  const onsetCL = Number((0.8 * CLmax).toPrecision(3));
  const atCLmax = Math.min(1, CD0);
  notes.push(
    `The drag polar now rises above the parabola near the stall: from CL ${onsetCL} (0.8 × CLmax) to ${atCLmax} more drag coefficient at CLmax (a default; set aircraft.polar.stallDragRise from your data). Speeds above 1.12 × stall speed are unchanged.`,
  );
  return { ...raw, aircraft: { ...ac, polar: { ...polar, stallDragRise: { onsetCL, atCLmax } } } };
};
