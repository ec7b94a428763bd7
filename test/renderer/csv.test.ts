import { describe, expect, it } from 'vitest';
import { displayValue } from '../../core/format.ts';
import { solvePlan } from '../../core/solver/solve.ts';
import { buildLegCsv, csvCell, fileStem } from '../../renderer/src/support/csv.ts';
import { examplePlan } from './fixtures.ts';

/** RFC 4180 reader, enough for the test: quoted fields with doubled quotes, CRLF rows. */
function readCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let cell = '';
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i];
    if (quoted) {
      if (ch === '"' && text[i + 1] === '"') {
        cell += '"';
        i++;
      } else if (ch === '"') quoted = false;
      else cell += ch;
    } else if (ch === '"') quoted = true;
    else if (ch === ',') {
      row.push(cell);
      cell = '';
    } else if (ch === '\r' && text[i + 1] === '\n') {
      row.push(cell);
      rows.push(row);
      row = [];
      cell = '';
      i++;
    } else cell += ch;
  }
  return rows;
}

describe('CSV export of the leg table', () => {
  const plan = examplePlan('twelve-legs');
  const result = solvePlan(plan);

  it('has a header with units, one row a leg and a totals row', () => {
    const rows = readCsv(buildLegCsv(plan, result, 'aviation'));
    expect(rows).toHaveLength(1 + plan.legs.length + 1);
    const header = rows[0] ?? [];
    expect(header).toContain('Ground distance (NM)');
    expect(header).toContain('Fuel used (lb)');
    expect(rows.every((r) => r.length === header.length)).toBe(true);
    expect(rows.at(-1)?.[0]).toBe('Total');
  });

  it('writes the solver values in display units at display resolution', () => {
    const rows = readCsv(buildLegCsv(plan, result, 'si'));
    const header = rows[0] ?? [];
    const col = header.indexOf('Ground distance (km)');
    const total = rows.at(-1)?.[col];
    // Same rounding as the screen and the CLI (core/format.ts displayValue), from solvePlan's totals.
    expect(Number(total)).toBe(displayValue(result.totals.groundDistance_m, 'distance', 'si'));
    const timeCol = header.indexOf('Time (min)');
    const leg3 = rows[3]?.[timeCol];
    expect(Number(leg3)).toBe(displayValue(result.legs[2]?.time_s ?? Number.NaN, 'time', 'si'));
  });

  it('quotes commas, quotes and line breaks, and defuses formulas', () => {
    expect(csvCell('plain')).toBe('plain');
    expect(csvCell('a,b')).toBe('"a,b"');
    expect(csvCell('say "hi"')).toBe('"say ""hi"""');
    expect(csvCell('two\nlines')).toBe('"two\nlines"');
    expect(csvCell('=SUM(A1:A9)')).toBe("'=SUM(A1:A9)");
    expect(csvCell(-3.5)).toBe('-3.5');
    expect(csvCell(Number.NaN)).toBe('');
  });

  it('a leg label with a comma survives the round trip', () => {
    const labelled = {
      ...plan,
      legs: plan.legs.map((l, i) => (i === 2 ? { ...l, label: 'Out, then "back"' } : l)),
    };
    const rows = readCsv(buildLegCsv(labelled, solvePlan(labelled), 'si'));
    expect(rows[3]?.[2]).toBe('Out, then "back"');
  });

  it('file names come from the plan name', () => {
    expect(fileStem('Quillon Q-150 — coastal patrol, two stations')).toBe(
      'Quillon-Q-150-coastal-patrol-two-stations',
    );
    expect(fileStem('***')).toBe('plan');
  });
});
