/**
 * A chart as plain data: x–y series on one or two y axes, in display units. Builders in
 * chartData.ts make these from results; XYChart.vue turns them into chart.js datasets.
 */
export interface XY {
  x: number;
  y: number;
}

export type SeriesRole =
  /** A curve (primary colour of its index). */
  | 'line'
  /** A second-axis curve. */
  | 'line2'
  /** Operating points, markers only. */
  | 'points'
  /** A vertical marker line (speeds, limits), dashed. */
  | 'mark'
  /** Something that fails, drawn in the failure colour. */
  | 'fail'
  /** Lower edge of a shaded band (second-axis colour, no legend entry). */
  | 'bandLow'
  /** Upper edge of a shaded band, filled down to the `bandLow` series just before it. */
  | 'bandHigh';

export interface Series {
  label: string;
  role: SeriesRole;
  axis: 'y' | 'y2';
  points: XY[];
}

export interface ChartSpec {
  xTitle: string;
  yTitle: string;
  y2Title?: string;
  /** Upper bound of the right axis where the quantity has one (state of charge: 100 %). */
  y2Max?: number;
  series: Series[];
  /** Start the y axes at zero. */
  beginAtZero?: boolean;
  /** Start the x axis at zero. */
  xFromZero?: boolean;
}

/** Points drawn in a chart (for tests and the data attribute on the canvas wrapper). */
export function pointCount(spec: ChartSpec): number {
  return spec.series.reduce((n, s) => n + s.points.length, 0);
}

/** A horizontal dashed line at y from x0 to x1. */
export function horizontalMark(label: string, y: number, x0: number, x1: number): Series {
  return {
    label,
    role: 'mark',
    axis: 'y',
    points: [
      { x: x0, y },
      { x: x1, y },
    ],
  };
}

/** A vertical dashed line at x from y0 to y1. */
export function verticalMark(label: string, x: number, y0: number, y1: number): Series {
  return {
    label,
    role: 'mark',
    axis: 'y',
    points: [
      { x, y: y0 },
      { x, y: y1 },
    ],
  };
}
