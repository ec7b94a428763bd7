/**
 * Robustness (DESIGN.md section 6): random and mutated plan files never make the loader
 * throw; every refusal carries at least one issue, and every issue's message starts with its
 * path. Accepted files are a fixed point of serialize → parse.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parsePlanText, serializePlan } from '../../../core/plan/load.ts';
import type { LoadResult } from '../../../core/plan/load.ts';
import { DEMO_FILES, demoJson, demoText } from './demoPlans.ts';

const TEXTS = DEMO_FILES.map(demoText);
const JSONS = DEMO_FILES.map(demoJson);

function checkResult(r: LoadResult): void {
  if (r.ok) {
    const text = serializePlan(r.plan);
    const again = parsePlanText(text);
    expect(again.ok).toBe(true);
    if (again.ok) expect(serializePlan(again.plan)).toBe(text);
    return;
  }
  expect(r.issues.length).toBeGreaterThan(0);
  for (const iss of r.issues) {
    expect(iss.path.length).toBeGreaterThan(0);
    expect(iss.message.startsWith(`${iss.path}: `)).toBe(true);
    // No computed NaN or unprintable object in the words; the path and quoted strings echo
    // what the file itself holds (a key or a string may well be "NaN"), so they are left out.
    const words = iss.message.slice(iss.path.length).replace(/"(?:[^"\\]|\\.)*"/g, '""');
    expect(words).not.toMatch(/NaN|\[object Object\]/);
  }
}

/** Every path in a JSON tree, containers included. */
function paths(node: unknown, prefix: (string | number)[] = []): (string | number)[][] {
  const out: (string | number)[][] = [prefix];
  if (Array.isArray(node)) node.forEach((v, i) => out.push(...paths(v, [...prefix, i])));
  else if (node && typeof node === 'object') {
    for (const [k, v] of Object.entries(node)) out.push(...paths(v, [...prefix, k]));
  }
  return out;
}

function parentOf(
  root: unknown,
  path: (string | number)[],
): Record<string | number, unknown> | undefined {
  let node = root as Record<string | number, unknown>;
  for (const key of path.slice(0, -1)) node = node[key] as Record<string | number, unknown>;
  return node && typeof node === 'object' ? node : undefined;
}

/** Same value, other JSON type (number ↔ string, object ↔ array …). */
function flipType(v: unknown): unknown {
  if (typeof v === 'number') return String(v);
  if (typeof v === 'string') return Number.isNaN(Number(v)) ? v.length : Number(v);
  if (typeof v === 'boolean') return v ? 1 : 0;
  if (Array.isArray(v)) return Object.fromEntries(v.map((x, i) => [i, x]));
  if (v && typeof v === 'object') return Object.values(v);
  return v === null ? {} : null;
}

const extremeNumber = fc.constantFrom(
  0,
  -0,
  -1,
  1e308,
  -1e308,
  5e-324,
  1e21,
  0.5,
  2 ** 53,
  Number.MAX_VALUE,
);

const mutation = fc.record({
  kind: fc.constantFrom('set', 'delete', 'flip', 'extreme', 'rename'),
  pick: fc.nat(),
  value: fc.jsonValue({ maxDepth: 2 }),
  extreme: extremeNumber,
  name: fc.oneof(
    fc.string({ maxLength: 12 }),
    fc.constantFrom(
      '__proto__',
      'constructor',
      'toString',
      'hasOwnProperty',
      'kind',
      'by',
      'payload_lb',
      '',
    ),
  ),
});

type Mutation = typeof mutation extends fc.Arbitrary<infer T> ? T : never;

function mutate(base: unknown, muts: Mutation[]): unknown {
  const root = structuredClone(base);
  for (const m of muts) {
    const all = paths(root).filter((p) => p.length > 0);
    const path = all[m.pick % all.length];
    if (!path) continue;
    const parent = parentOf(root, path);
    const key = path[path.length - 1] as string | number;
    if (!parent) continue;
    if (m.kind === 'set') parent[key] = m.value;
    else if (m.kind === 'delete') {
      if (Array.isArray(parent)) parent.splice(Number(key), 1);
      else delete parent[key];
    } else if (m.kind === 'flip') parent[key] = flipType(parent[key]);
    else if (m.kind === 'extreme') parent[key] = m.extreme;
    else if (!Array.isArray(parent)) {
      const value = parent[key];
      delete parent[key];
      // defineProperty, so that `__proto__` becomes a real key as JSON.parse would make it
      Object.defineProperty(parent, m.name, {
        value,
        enumerable: true,
        writable: true,
        configurable: true,
      });
    }
  }
  return root;
}

describe('loader fuzz (fast-check)', () => {
  it('survives 6000 structurally mutated demo plans', () => {
    fc.assert(
      fc.property(
        fc.nat(JSONS.length - 1),
        fc.array(mutation, { minLength: 1, maxLength: 4 }),
        (i, muts) => {
          const text = JSON.stringify(mutate(JSONS[i], muts));
          checkResult(parsePlanText(text ?? 'null'));
        },
      ),
      { numRuns: 6000 },
    );
  });

  it('survives 2500 damaged texts (truncated, spliced)', () => {
    fc.assert(
      fc.property(
        fc.nat(TEXTS.length - 1),
        fc.nat(),
        fc.nat(),
        fc.string({ maxLength: 8 }),
        (i, a, b, junk) => {
          const text = TEXTS[i] as string;
          const cut = a % (text.length + 1);
          const at = b % (text.length + 1);
          checkResult(parsePlanText(text.slice(0, cut)));
          checkResult(parsePlanText(text.slice(0, at) + junk + text.slice(at)));
        },
      ),
      { numRuns: 2500 },
    );
  });

  it('survives 1500 random JSON documents and strings', () => {
    fc.assert(
      fc.property(fc.oneof(fc.json({ maxDepth: 4 }), fc.string()), (text) => {
        checkResult(parsePlanText(text));
      }),
      { numRuns: 1500 },
    );
  });
});
