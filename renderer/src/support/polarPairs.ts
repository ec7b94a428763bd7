/**
 * Measured (CL, CD) pairs pasted as text: one pair a line, separated by a comma, semicolon,
 * tab or spaces (a spreadsheet column pair pastes as tab-separated). Lines starting with
 * `#` and a header line of words are skipped; every other unreadable line is reported.
 */
import type { PolarFitPoint } from '../../../core/polarFit.ts';
import { parseNumberText } from './fieldBinding.ts';

export interface PairsParse {
  points: PolarFitPoint[];
  /** Line numbers (1-based) with the reason they were not read. */
  errors: { line: number; message: string }[];
}

export function parsePairs(text: string): PairsParse {
  const points: PolarFitPoint[] = [];
  const errors: PairsParse['errors'] = [];
  text.split(/\r?\n/).forEach((raw, i) => {
    const line = raw.trim();
    if (line === '' || line.startsWith('#')) return;
    const parts = line.split(/\s*[;,\t]\s*|\s+/).filter((p) => p !== '');
    if (points.length === 0 && errors.length === 0 && parts.every((p) => /^[A-Za-z_ ()]+$/.test(p)))
      return;
    if (parts.length !== 2) {
      errors.push({
        line: i + 1,
        message: `expected two numbers (CL and CD), found ${parts.length} item(s)`,
      });
      return;
    }
    const [a, b] = parts.map((p) => parseNumberText(p));
    if (!a?.ok || !b?.ok) {
      errors.push({ line: i + 1, message: 'CL and CD must be numbers' });
      return;
    }
    if (!(b.value > 0)) {
      errors.push({ line: i + 1, message: 'CD must be above 0' });
      return;
    }
    points.push({ CL: a.value, CD: b.value });
  });
  return { points, errors };
}
