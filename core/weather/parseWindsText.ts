/**
 * Winds aloft pasted as plain-text columns: altitude, direction (from, true), speed and an
 * optional temperature, one level a line. A header line names the unit of each column,
 * either bare (`ft deg kt C`, `m deg m/s K`) or after a column name (`alt_ft dir spd_kt
 * temp_C`); columns may come in any order, since each unit names its quantity. `#` starts
 * a comment. A last temperature column may be left empty on a line. Altitudes are pressure altitudes, as forecasts of winds aloft give them
 * (common practice); a temperature becomes an ISA offset against the standard temperature
 * at that pressure altitude (1976 U.S. Standard Atmosphere, core/atmosphere.ts).
 * Conversion factors are the exact ones of core/units.ts (NIST SP 811).
 */
import { MAX_ISA_OFFSET_K, MIN_ISA_OFFSET_K, atmosphereAt } from '../atmosphere.ts';
import { FT, KMH, KT, STATUTE_MILE } from '../units.ts';
import {
  MAX_WIND_LEVELS,
  WIND_ALTITUDE_MAX_M,
  WIND_ALTITUDE_MIN_M,
  WIND_SPEED_MAX_M_S,
  type WindLevel,
} from './windsAloft.ts';

export type WindColumn = 'altitude' | 'direction' | 'speed' | 'temperature';

interface ColumnUnit {
  role: WindColumn;
  label: string;
  /** SI value (m, deg, m/s, K) = v·factor + offset. */
  factor: number;
  offset?: number;
}

// Keys lower-case: units are matched without regard to case ('KT', 'kt', 'Kt').
const UNITS: Readonly<Record<string, ColumnUnit>> = {
  m: { role: 'altitude', label: 'm', factor: 1 },
  km: { role: 'altitude', label: 'km', factor: 1000 },
  ft: { role: 'altitude', label: 'ft', factor: FT },
  fl: { role: 'altitude', label: 'FL', factor: 100 * FT }, // flight level = hundreds of feet
  deg: { role: 'direction', label: 'deg', factor: 1 },
  '°': { role: 'direction', label: 'deg', factor: 1 },
  kt: { role: 'speed', label: 'kt', factor: KT },
  kts: { role: 'speed', label: 'kt', factor: KT },
  'm/s': { role: 'speed', label: 'm/s', factor: 1 },
  m_s: { role: 'speed', label: 'm/s', factor: 1 },
  mps: { role: 'speed', label: 'm/s', factor: 1 },
  'km/h': { role: 'speed', label: 'km/h', factor: KMH },
  km_h: { role: 'speed', label: 'km/h', factor: KMH },
  kmh: { role: 'speed', label: 'km/h', factor: KMH },
  mph: { role: 'speed', label: 'mph', factor: STATUTE_MILE / 3600 },
  c: { role: 'temperature', label: '°C', factor: 1, offset: 273.15 },
  degc: { role: 'temperature', label: '°C', factor: 1, offset: 273.15 },
  '°c': { role: 'temperature', label: '°C', factor: 1, offset: 273.15 },
  k: { role: 'temperature', label: 'K', factor: 1 },
  f: { role: 'temperature', label: '°F', factor: 5 / 9, offset: 273.15 - (32 * 5) / 9 },
  degf: { role: 'temperature', label: '°F', factor: 5 / 9, offset: 273.15 - (32 * 5) / 9 },
  '°f': { role: 'temperature', label: '°F', factor: 5 / 9, offset: 273.15 - (32 * 5) / 9 },
};

const NAMES: Readonly<Record<string, WindColumn>> = {
  alt: 'altitude',
  altitude: 'altitude',
  level: 'altitude',
  height: 'altitude',
  dir: 'direction',
  direction: 'direction',
  wdir: 'direction',
  spd: 'speed',
  speed: 'speed',
  wspd: 'speed',
  temp: 'temperature',
  temperature: 'temperature',
  oat: 'temperature',
  sat: 'temperature',
};

export interface WindsTextIssue {
  /** 1-based line of the pasted text. */
  line: number;
  /** Names the line, the column, the value and the limit. */
  message: string;
}

export interface WindsTextResult {
  /** True when every line was read and at least one level was found. */
  ok: boolean;
  /** The levels of the good lines, sorted by altitude. */
  levels: WindLevel[];
  issues: WindsTextIssue[];
}

interface Column extends ColumnUnit {
  header: string;
}

const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)$/;
const SEPARATORS = /[\s,;]+/;

export function parseWindsText(text: string): WindsTextResult {
  const issues: WindsTextIssue[] = [];
  const found: { level: WindLevel; line: number }[] = [];
  // Altitude → the line that gave it first: the repeat check stays O(1) per line.
  const firstLine = new Map<number, number>();
  let columns: Column[] | undefined;
  const lines = text.split(/\r\n|\r|\n/);
  for (let i = 0; i < lines.length; i++) {
    const line = i + 1;
    const cells = (lines[i] as string).replace(/#.*$/, '').trim().split(SEPARATORS);
    if (cells.length === 1 && cells[0] === '') continue;
    if (!columns) {
      const header = readHeader(cells, line);
      if (typeof header === 'string')
        return { ok: false, levels: [], issues: [{ line, message: header }] };
      columns = header;
      continue;
    }
    const r = readLevel(cells, columns, line);
    if (typeof r === 'string') issues.push({ line, message: r });
    else {
      const twin = firstLine.get(r.altitude_m);
      if (twin !== undefined)
        issues.push({ line, message: `line ${line}: the altitude repeats line ${twin}` });
      else {
        firstLine.set(r.altitude_m, line);
        found.push({ level: r, line });
      }
    }
  }
  if (!columns) {
    issues.push({ line: 1, message: `line 1: no header naming the units, e.g. 'ft deg kt C'` });
  } else if (found.length > MAX_WIND_LEVELS) {
    issues.push({ line: lines.length, message: `at most ${MAX_WIND_LEVELS} levels are read` });
  }
  const levels = found.map((f) => f.level).sort((a, b) => a.altitude_m - b.altitude_m);
  return { ok: issues.length === 0 && levels.length > 0, levels, issues };
}

function readHeader(cells: string[], line: number): Column[] | string {
  const example = `e.g. 'ft deg kt C' or 'alt_m dir spd_m/s temp_K'`;
  if (NUMBER.test(cells[0] as string)) {
    return `line ${line}: expected a header naming the units of the columns, ${example}`;
  }
  const columns: Column[] = [];
  for (const [k, header] of cells.entries()) {
    const unit = columnUnit(header);
    if (!unit) {
      return `line ${line}, column ${k + 1}: '${header}' names no known unit, ${example}`;
    }
    if (typeof unit === 'string') return `line ${line}, column ${k + 1}: ${unit}`;
    if (columns.some((c) => c.role === unit.role)) {
      return `line ${line}, column ${k + 1}: a second ${unit.role} column ('${header}')`;
    }
    columns.push({ ...unit, header });
  }
  const missing = (['altitude', 'direction', 'speed'] as const).filter(
    (role) => !columns.some((c) => c.role === role),
  );
  if (missing.length > 0) return `line ${line}: the header has no ${missing.join(' or ')} column`;
  return columns;
}

/** A bare unit, a name with a unit (`alt_ft`, `spd_m/s`), or `dir` alone (degrees). */
function columnUnit(header: string): ColumnUnit | string | undefined {
  const h = header.toLowerCase();
  const bare = UNITS[h];
  if (bare) return bare;
  const cut = h.indexOf('_');
  const name = NAMES[cut < 0 ? h : h.slice(0, cut)];
  if (!name) return undefined;
  if (cut < 0) {
    return name === 'direction' ? UNITS['deg'] : `'${header}' needs a unit, e.g. '${h}_ft'`;
  }
  const unit = UNITS[h.slice(cut + 1)];
  if (!unit) return undefined;
  if (unit.role !== name) return `'${header}': ${unit.label} is not a unit of ${name}`;
  return unit;
}

function readLevel(cells: string[], columns: Column[], line: number): WindLevel | string {
  // A level without a temperature (forecasts omit it near the ground) may leave out a last
  // temperature column.
  const tempLast = columns[columns.length - 1]?.role === 'temperature';
  const short = tempLast && cells.length === columns.length - 1;
  if (cells.length !== columns.length && !short) {
    const names = columns.map((c) => c.header).join(' ');
    return `line ${line}: expected ${columns.length} values (${names}), found ${cells.length}`;
  }
  const si: Partial<Record<WindColumn, number>> = {};
  for (const [k, c] of columns.entries()) {
    const raw = cells[k];
    if (raw === undefined) break;
    const where = `line ${line}, column ${k + 1} (${c.role}, ${c.label})`;
    if (!NUMBER.test(raw)) return `${where}: '${raw}' is not a number`;
    const v = Number(raw);
    const [lo, hi] = limitsSI(c.role);
    const value = v * c.factor + (c.offset ?? 0);
    if (!(value >= lo && value <= hi)) {
      const lim = (x: number) => Number(((x - (c.offset ?? 0)) / c.factor).toPrecision(5));
      return `${where}: ${v} is out of range; must be between ${lim(lo)} and ${lim(hi)} ${c.label}`;
    }
    si[c.role] = value;
  }
  const level: WindLevel = {
    altitude_m: si.altitude as number,
    from_deg: si.direction as number,
    speed_m_s: si.speed as number,
  };
  if (si.temperature !== undefined) {
    // Pressure altitudes lie on the standard's geopotential scale.
    const standard_K = atmosphereAt(level.altitude_m).T_K;
    const offset = si.temperature - standard_K;
    if (offset < MIN_ISA_OFFSET_K || offset > MAX_ISA_OFFSET_K) {
      const c = columns.find((col) => col.role === 'temperature') as Column;
      const k = columns.indexOf(c) + 1;
      const rounded = Number(offset.toPrecision(4));
      return (
        `line ${line}, column ${k} (temperature, ${c.label}): ISA${rounded >= 0 ? '+' : ''}${rounded} K ` +
        `is out of range; the offset from ISA must be between ${MIN_ISA_OFFSET_K} and ${MAX_ISA_OFFSET_K} K`
      );
    }
    level.isaOffset_K = offset;
  }
  return level;
}

function limitsSI(role: WindColumn): [number, number] {
  if (role === 'altitude') return [WIND_ALTITUDE_MIN_M, WIND_ALTITUDE_MAX_M];
  if (role === 'direction') return [0, 360];
  if (role === 'speed') return [0, WIND_SPEED_MAX_M_S];
  return [100, 400]; // K: beyond any air temperature in the troposphere and stratosphere
}
