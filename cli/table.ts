/** Plain-text tables for the terminal: padded columns, numbers right-aligned. */

export type Align = 'left' | 'right';

export interface Column {
  header: string;
  align: Align;
}

/** Lines of a table with a header, a rule and the rows (cells already formatted). */
export function renderTable(
  columns: readonly Column[],
  rows: readonly (readonly string[])[],
): string[] {
  const widths = columns.map((c, j) =>
    Math.max(c.header.length, ...rows.map((r) => (r[j] ?? '').length)),
  );
  const line = (cells: readonly string[]): string =>
    columns
      .map((c, j) => {
        const cell = cells[j] ?? '';
        const w = widths[j] ?? 0;
        return c.align === 'right' ? cell.padStart(w) : cell.padEnd(w);
      })
      .join('  ')
      .trimEnd();
  const rule = widths.map((w) => '-'.repeat(w)).join('  ');
  return [line(columns.map((c) => c.header)), rule, ...rows.map(line)];
}

/** Shortens text to `max` characters with an ellipsis. */
export function clip(text: string, max: number): string {
  return text.length <= max ? text : `${text.slice(0, Math.max(0, max - 1))}…`;
}

/** One CSV field (RFC 4180 quoting). */
export function csvField(value: string | number): string {
  const s = typeof value === 'number' ? (Number.isFinite(value) ? String(value) : '') : value;
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}
