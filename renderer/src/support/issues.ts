/**
 * Plan-check issues on the screen: each issue belongs to the field whose path it names
 * (or, for an issue on a whole sub-object such as a leg's speed, to that object's discriminator), the rest go to the
 * general list. The loader's message starts with the path, which the field does not repeat.
 */
import type { PlanIssue } from '../../../core/plan/issues.ts';
import { convert, UNITS, type UnitId } from '../../../core/units.ts';
import { plainNumber } from './fieldBinding.ts';
import { parentPath } from './fieldTypes.ts';
import { pathCovers } from './paths.ts';

export interface FieldIssues {
  /** Message for each field path that has one (path prefix stripped). */
  byField: Map<string, string>;
  /** Issues no shown field covers, full message. */
  general: PlanIssue[];
}

/** The message without its leading `path: `. */
export function shortMessage(issue: PlanIssue): string {
  const prefix = `${issue.path}: `;
  return issue.message.startsWith(prefix) ? issue.message.slice(prefix.length) : issue.message;
}

export function assignIssues(
  issues: readonly PlanIssue[],
  fieldPaths: readonly string[],
): FieldIssues {
  const byField = new Map<string, string>();
  const general: PlanIssue[] = [];
  for (const issue of issues) {
    const owner = fieldPaths.includes(issue.path)
      ? issue.path
      : (fieldPaths.find((f) => parentPath(f) === issue.path) ??
        fieldPaths.find((f) => pathCovers(f, issue.path)));
    if (owner === undefined) {
      general.push(issue);
      continue;
    }
    const text = shortMessage(issue);
    const before = byField.get(owner);
    byField.set(owner, before ? `${before}; ${text}` : text);
  }
  return { byField, general };
}

/**
 * The plan check states limits in the stored unit ("must be from 0.01 to 500000 kg"); a
 * field shown in other units restates the limit in its own unit, so the person can compare
 * it with what they typed.
 */
export function limitInUnit(message: string, stored: UnitId, shown: UnitId): string {
  if (stored === shown) return message;
  const m = /must be (from|above) (-?[\d.e+]+) to (-?[\d.e+]+)/.exec(message);
  if (!m) return message;
  const [, word, a, b] = m;
  const lo = plainNumber(convert(Number(a), stored, shown), 4);
  const hi = plainNumber(convert(Number(b), stored, shown), 4);
  const label = UNITS[shown].label;
  return `must be ${word} ${lo} to ${hi}${label ? ` ${label}` : ''}`;
}
