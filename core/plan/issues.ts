/**
 * Plan-file problems in words: each zod issue becomes one message that starts with the JSON
 * path, then the offending value, then the limit. Also walks the plan schema alongside the raw
 * data to find fields the schema does not know (zod would drop them silently, hiding typos such
 * as `payload_lb`) and to write plans back with the schema's key order.
 */
import type { z } from 'zod';

export interface PlanIssue {
  /** Dotted JSON path, e.g. `legs.2.speed.kind`; `file` for the document as a whole. */
  path: string;
  /** Starts with `path`, then names the value and the limit. */
  message: string;
}

type PathKey = PropertyKey;

/** `aircraft.mass.empty_kg`, `legs.3.end.by`; the root is called `file`; odd keys are quoted. */
export function pathString(path: readonly PathKey[]): string {
  if (path.length === 0) return 'file';
  return path
    .map((p) => (typeof p === 'string' && !/^[\w$-]+$/.test(p) ? JSON.stringify(p) : String(p)))
    .join('.');
}

export function issue(path: readonly PathKey[] | string, text: string): PlanIssue {
  const p = typeof path === 'string' ? path : pathString(path);
  return { path: p, message: `${p}: ${text}` };
}

function isRecord(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

/** The input value at a zod path, or undefined when the path leaves the data. */
export function valueAt(data: unknown, path: readonly PathKey[]): unknown {
  let v: unknown = data;
  for (const key of path) {
    if (Array.isArray(v) && typeof key === 'number') v = v[key];
    else if (isRecord(v) && typeof key === 'string' && Object.hasOwn(v, key)) v = v[key];
    else return undefined;
  }
  return v;
}

/** A short, safe rendering of any JSON value for a message. */
export function describeValue(v: unknown): string {
  if (v === undefined) return 'missing';
  if (v === null) return 'null';
  if (typeof v === 'number' || typeof v === 'boolean') return String(v);
  if (typeof v === 'string') {
    const s = JSON.stringify(v.length > 40 ? `${v.slice(0, 40)}…` : v);
    return v.length === 0 ? 'empty text ""' : s;
  }
  if (Array.isArray(v)) return `a list of ${v.length}`;
  return 'an object';
}

const EXPECTED_WORDS: Record<string, string> = {
  number: 'a finite number',
  string: 'text in quotes',
  object: 'an object { … }',
  array: 'a list [ … ]',
  boolean: 'true or false',
};

function oneOf(values: readonly unknown[]): string {
  const list = values.map((v) => JSON.stringify(v)).join(', ');
  return values.length === 1 ? `must be ${list}` : `must be one of ${list}`;
}

function plural(n: number, word: string): string {
  return `${n} ${word}${n === 1 ? '' : 's'}`;
}

function sizeLimit(origin: string, bound: 'at least' | 'at most', n: number): string {
  if (origin === 'string') return `must have ${bound} ${plural(n, 'character')}`;
  if (origin === 'array') return `must have ${bound} ${plural(n, 'item')}`;
  return `must be ${bound} ${n}`;
}

/** Why the value is refused, from the issue's structured fields (schema wording kept for custom checks). */
function reason(iss: z.core.$ZodIssue): string {
  switch (iss.code) {
    case 'custom':
      return iss.message;
    case 'invalid_type':
      return iss.message.startsWith('must ')
        ? iss.message
        : `must be ${EXPECTED_WORDS[iss.expected] ?? iss.expected}`;
    // A number's bounds carry the schema's own words ("must be from 0 to 100 m/s").
    case 'too_small':
      return iss.origin === 'number' && iss.message.startsWith('must ')
        ? iss.message
        : sizeLimit(iss.origin, 'at least', Number(iss.minimum));
    case 'too_big':
      return iss.origin === 'number' && iss.message.startsWith('must ')
        ? iss.message
        : sizeLimit(iss.origin, 'at most', Number(iss.maximum));
    case 'invalid_value':
      return oneOf(iss.values);
    case 'invalid_union': {
      const options = (iss as { options?: unknown[] }).options;
      return Array.isArray(options) ? oneOf(options) : 'does not match any allowed form';
    }
    case 'invalid_format':
      return `must be a valid ${iss.format}`;
    default:
      return iss.message;
  }
}

/** One zod issue → one path-named message with the value taken from the input. */
export function planIssueFromZod(iss: z.core.$ZodIssue, input: unknown): PlanIssue {
  if (iss.code === 'unrecognized_keys') {
    return issue(iss.path, `unknown field(s) ${iss.keys.map((k) => JSON.stringify(k)).join(', ')}`);
  }
  return issue(iss.path, `${describeValue(valueAt(input, iss.path))} — ${reason(iss)}`);
}

// --- Walking the schema alongside data ------------------------------------------------------
interface Def {
  type: string;
  shape?: Record<string, Node>;
  options?: Node[];
  discriminator?: string;
  element?: Node;
  innerType?: Node;
  values?: unknown[];
}
interface Node {
  _zod: { def: Def };
}

/** Strips optional/default/nullable wrappers. */
function unwrap(node: Node): Node {
  let n = node;
  while (n._zod.def.innerType !== undefined) n = n._zod.def.innerType;
  return n;
}

/** The variant of a discriminated union that the data selects, if any. */
function variantFor(def: Def, data: Record<string, unknown>): Node | undefined {
  const key = def.discriminator;
  if (key === undefined || def.options === undefined) return undefined;
  return def.options.find((opt) => {
    const lit = unwrap(opt)._zod.def.shape?.[key];
    return lit !== undefined && (unwrap(lit)._zod.def.values ?? []).includes(data[key]);
  });
}

/** The object or array schema governing `data`, with unions resolved; undefined for leaves. */
function resolve(schema: Node, data: unknown): Def | undefined {
  const def = unwrap(schema)._zod.def;
  if (def.type === 'union' && isRecord(data)) {
    const variant = variantFor(def, data);
    return variant === undefined ? undefined : resolve(variant, data);
  }
  if (def.type === 'object' && isRecord(data)) return def;
  if (def.type === 'array' && Array.isArray(data)) return def;
  return undefined;
}

/** Fields present in `data` that the schema does not define, each as an issue. */
export function unknownFieldIssues(schema: z.ZodType, data: unknown): PlanIssue[] {
  const out: PlanIssue[] = [];
  const walk = (node: Node, value: unknown, path: PathKey[]): void => {
    const def = resolve(node, value);
    if (def?.shape !== undefined && isRecord(value)) {
      const known = Object.keys(def.shape);
      for (const key of Object.keys(value)) {
        const child = Object.hasOwn(def.shape, key) ? def.shape[key] : undefined;
        if (child === undefined) {
          out.push(issue([...path, key], `unknown field — expected one of ${known.join(', ')}`));
        } else walk(child, value[key], [...path, key]);
      }
    } else if (def?.element !== undefined && Array.isArray(value)) {
      const element = def.element;
      value.forEach((item, i) => walk(element, item, [...path, i]));
    }
  };
  walk(schema as unknown as Node, data, []);
  return out;
}

/** A copy of `value` with object keys in the schema's declaration order (unknown keys dropped). */
export function orderBySchema(schema: z.ZodType, value: unknown): unknown {
  const walk = (node: Node, v: unknown): unknown => {
    const def = resolve(node, v);
    if (def?.shape !== undefined && isRecord(v)) {
      const out: Record<string, unknown> = {};
      for (const [key, child] of Object.entries(def.shape)) {
        if (v[key] !== undefined) out[key] = walk(child, v[key]);
      }
      return out;
    }
    if (def?.element !== undefined && Array.isArray(v)) {
      const element = def.element;
      return v.map((item) => walk(element, item));
    }
    return v;
  };
  return walk(schema as unknown as Node, value);
}
