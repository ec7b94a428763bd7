/**
 * Descriptions of the plan's editable fields: where the value lives (a dotted plan path),
 * which quantity it is (for the unit system) and the unit its key stores it in.
 */
import type { Plan } from '../../../core/plan/schema.ts';
import type { Quantity, UnitId } from '../../../core/units.ts';
import type { AltitudeDatum } from './heightReference.ts';

/**
 * An optional block of the plan (`aircraft.field`, `uncertainty` …) that a field lives in.
 * While the block is absent the field shows the value `create` would give it (the default
 * the core applies), and the first edit writes the whole block with that value changed.
 */
export interface OptionalBlock {
  path: string;
  create: (plan: Plan) => unknown;
}

export interface NumberFieldDef {
  type: 'number';
  path: string;
  label: string;
  /** Display quantity; null = a plain number shown as stored (CD0, Oswald e, exponents). */
  quantity: Quantity | null;
  /** Unit the plan stores the value in (the unit in its key). */
  stored: UnitId;
  /** May be left empty (the key is then removed). */
  optional?: boolean;
  hint?: string;
  block?: OptionalBlock;
  /** Significant digits shown for a plain number that is not exact in 6 (coordinates). */
  digits?: number;
  /**
   * An altitude above MSL named with its reference: 'launch' boxes follow the height
   * reference setting (MSL or above the departure field), 'msl' boxes are always MSL.
   */
  datum?: AltitudeDatum;
}

export interface ChoiceOption {
  value: string;
  label: string;
}

export interface ChoiceFieldDef {
  type: 'choice';
  path: string;
  label: string;
  options: readonly ChoiceOption[];
  /**
   * For a discriminator (`speed.kind`, `end.by` …): builds the whole parent object for the
   * chosen variant from the current one, carrying over what still applies.
   */
  variant?: (value: string, current: unknown) => unknown;
  /** Shown while the plan has no value at `path` (an absent optional block). */
  fallback?: string;
  /** A choice that reshapes more of the plan than its parent object (adds or drops a block). */
  apply?: (plan: Plan, value: string) => Plan;
}

export interface TextFieldDef {
  type: 'text';
  path: string;
  label: string;
  maxLength: number;
}

export type FieldDef = NumberFieldDef | ChoiceFieldDef | TextFieldDef;

export interface FieldSection {
  id: string;
  title: string;
  fields: FieldDef[];
}

export function num(
  path: string,
  label: string,
  quantity: Quantity | null,
  stored: UnitId,
  extra: Partial<Pick<NumberFieldDef, 'optional' | 'hint' | 'block' | 'digits' | 'datum'>> = {},
): NumberFieldDef {
  return { type: 'number', path, label, quantity, stored, ...extra };
}

export function choice(
  path: string,
  label: string,
  options: readonly ChoiceOption[],
  variant?: ChoiceFieldDef['variant'],
): ChoiceFieldDef {
  return variant
    ? { type: 'choice', path, label, options, variant }
    : { type: 'choice', path, label, options };
}

export function text(path: string, label: string, maxLength = 120): TextFieldDef {
  return { type: 'text', path, label, maxLength };
}

/** A field's id for `label for=`, `data-testid` and tests: `field-` + its plan path. */
export function fieldId(path: string): string {
  return `field-${path}`;
}

/** The parent path of a discriminator path (`legs.2.speed.kind` → `legs.2.speed`). */
export function parentPath(path: string): string {
  const cut = path.lastIndexOf('.');
  return cut < 0 ? '' : path.slice(0, cut);
}
