/**
 * What the person typed for a value, so that the box shows their own text again when the
 * value comes back (undo, redo, switching a unit away and back): "0.0280" stays "0.0280",
 * "1,500" stays "1,500". A text is only reused for exactly the value it was read as, in the
 * same unit and the same locale, so it always stands for the value shown.
 */
import type { UnitId } from '../../../core/units.ts';

interface Typed {
  readonly stored: number;
  readonly unit: UnitId;
  readonly locale: string;
  readonly text: string;
}

const PER_FIELD = 24;

export interface TypedTexts {
  remember(path: string, typed: Typed): void;
  lookup(path: string, stored: number, unit: UnitId, locale: string): string | undefined;
}

export function createTypedTexts(): TypedTexts {
  const byPath = new Map<string, Typed[]>();
  return {
    remember(path, typed) {
      if (!Number.isFinite(typed.stored)) return;
      const list = (byPath.get(path) ?? []).filter(
        (t) => !(t.stored === typed.stored && t.unit === typed.unit && t.locale === typed.locale),
      );
      list.push(typed);
      byPath.set(path, list.slice(-PER_FIELD));
    },
    lookup(path, stored, unit, locale) {
      const list = byPath.get(path) ?? [];
      for (let i = list.length - 1; i >= 0; i--) {
        const t = list[i]!;
        if (t.stored === stored && t.unit === unit && t.locale === locale) return t.text;
      }
      return undefined;
    },
  };
}

/** One memory for the page (every number box shares it). */
export const typedTexts: TypedTexts = createTypedTexts();
