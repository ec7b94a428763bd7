/**
 * The one error class core throws for invalid input. It always names the field,
 * the offending value and the limit that was broken, so every layer above can show
 * a precise message instead of a NaN.
 */
export class InputError extends Error {
  override readonly name = 'InputError';
  constructor(
    /** Dotted path or parameter name, e.g. `legs.2.altitude_m` or `pressureAltitude_m`. */
    readonly field: string,
    /** The value that was refused. */
    readonly value: unknown,
    /** The limit in words, e.g. `between -5000 and 84852 m`. */
    readonly limit: string,
  ) {
    super(`${field}: ${formatValue(value)} is out of range; must be ${limit}`);
  }
}

function formatValue(value: unknown): string {
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : String(value);
  if (typeof value === 'string') return JSON.stringify(value);
  try {
    return JSON.stringify(value) ?? String(value);
  } catch {
    return String(value);
  }
}

/** Throws InputError unless `value` is a finite number within [min, max]. */
export function requireFinite(
  field: string,
  value: number,
  min = -Infinity,
  max = Infinity,
  unit = '',
): number {
  const u = unit ? ` ${unit}` : '';
  if (!Number.isFinite(value)) throw new InputError(field, value, `a finite number${u}`);
  if (value < min || value > max) {
    const limit =
      min === -Infinity
        ? `at most ${max}${u}`
        : max === Infinity
          ? `at least ${min}${u}`
          : `between ${min} and ${max}${u}`;
    throw new InputError(field, value, limit);
  }
  return value;
}

/** Throws InputError unless `value` is finite and strictly positive. */
export function requirePositive(field: string, value: number, unit = ''): number {
  const u = unit ? ` ${unit}` : '';
  if (!Number.isFinite(value) || value <= 0)
    throw new InputError(field, value, `a finite number above 0${u}`);
  return value;
}
