/**
 * ChartSpec → chart.js configuration (scatter charts with lines: both axes numeric).
 * Animation is off so that what is drawn is final at once — steady for tests, screenshots
 * and printing — and drawing needs no GPU (canvas 2D).
 */
import type { ChartData, ChartOptions, ScatterDataPoint } from 'chart.js';
import type { ChartSpec, Series, SeriesRole } from './chartSpec.ts';

export interface ChartColors {
  text: string;
  grid: string;
  line: string;
  line2: string;
  points: string;
  mark: string;
  fail: string;
  /** Heavier lines in the high-contrast theme. */
  width: number;
}

export const NORMAL_COLORS: ChartColors = {
  text: '#1d2430',
  grid: '#d5dae2',
  line: '#1f5fbf',
  line2: '#b35900',
  points: '#111827',
  mark: '#6b7280',
  fail: '#b3261e',
  width: 2,
};

export const CONTRAST_COLORS: ChartColors = {
  text: '#000000',
  grid: '#8a8a8a',
  line: '#000000',
  line2: '#0038b8',
  points: '#000000',
  mark: '#333333',
  fail: '#c00000',
  width: 3,
};

/** Night: warm and dim, no blue above red or green (see the night theme in base.css). */
export const NIGHT_COLORS: ChartColors = {
  text: '#d9c7ad',
  grid: '#3a322a',
  line: '#e0a04a',
  line2: '#9cc27a',
  points: '#e8d6b8',
  mark: '#a8977f',
  fail: '#f08a6c',
  width: 2,
};

const MARK_COLORS = ['#7c3aed', '#0f766e', '#9d174d', '#4b5563'];

function colorOf(role: SeriesRole, colors: ChartColors, markIndex: number): string {
  if (role === 'mark')
    return colors === CONTRAST_COLORS || colors === NIGHT_COLORS
      ? colors.mark
      : (MARK_COLORS[markIndex % MARK_COLORS.length] ?? colors.mark);
  return colors[
    role === 'line'
      ? 'line'
      : role === 'line2' || role === 'bandLow' || role === 'bandHigh'
        ? 'line2'
        : role === 'points'
          ? 'points'
          : 'fail'
  ];
}

/** A translucent fill of a #rrggbb colour. */
function translucent(color: string, alpha: number): string {
  const m = /^#([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(color);
  if (!m) return color;
  const [r, g, b] = [m[1], m[2], m[3]].map((h) => parseInt(h ?? '0', 16));
  return `rgba(${r}, ${g}, ${b}, ${alpha})`;
}

function dataset(s: Series, colors: ChartColors, markIndex: number) {
  const color = colorOf(s.role, colors, markIndex);
  const isPoints = s.role === 'points';
  if (s.role === 'bandLow' || s.role === 'bandHigh') {
    // The band: thin dashed edges, the upper one filled down to the lower (the series before it).
    return {
      label: s.label,
      data: s.points as ScatterDataPoint[],
      yAxisID: s.axis,
      showLine: true,
      borderColor: color,
      backgroundColor: translucent(color, colors === CONTRAST_COLORS ? 0.28 : 0.18),
      borderWidth: 1,
      borderDash: [3, 3],
      pointRadius: 0,
      pointHoverRadius: 3,
      tension: 0,
      fill: s.role === 'bandHigh' ? '-1' : false,
      order: 2,
    };
  }
  return {
    label: s.label,
    data: s.points as ScatterDataPoint[],
    yAxisID: s.axis,
    showLine: !isPoints,
    borderColor: color,
    backgroundColor: color,
    borderWidth: s.role === 'fail' ? colors.width + 2 : s.role === 'mark' ? 1.5 : colors.width,
    borderDash:
      s.role === 'mark' ? [6, 4] : s.role === 'line2' && colors === CONTRAST_COLORS ? [8, 3] : [],
    fill: false,
    // One radius per dataset, never per point: chart.js then shares the resolved options
    // among all points, which keeps an update cheap.
    pointRadius: isPoints ? 4 : 0,
    pointHoverRadius: isPoints ? 7 : 4,
    pointStyle: isPoints ? ('rectRot' as const) : ('circle' as const),
    tension: 0,
    order: isPoints || s.role === 'fail' ? 0 : 1,
  };
}

export function chartData(spec: ChartSpec, colors: ChartColors): ChartData<'scatter'> {
  let marks = 0;
  return {
    datasets: spec.series.map((s) => dataset(s, colors, s.role === 'mark' ? marks++ : 0)),
  };
}

export function chartOptions(
  spec: ChartSpec,
  colors: ChartColors,
  responsive = true,
): ChartOptions<'scatter'> {
  const axisTitle = (text: string) => ({
    display: true,
    text,
    color: colors.text,
    font: { size: 12, weight: 'bold' as const },
  });
  const ticks = { color: colors.text, font: { size: 11 } };
  const hasY2 = spec.series.some((s) => s.axis === 'y2');
  return {
    animation: false,
    responsive,
    maintainAspectRatio: false,
    normalized: true,
    // Points are given as {x, y} already: no parsing pass on every update.
    parsing: false,
    interaction: { mode: 'nearest', intersect: false },
    scales: {
      x: {
        type: 'linear',
        beginAtZero: spec.xFromZero ?? false,
        title: axisTitle(spec.xTitle),
        ticks,
        grid: { color: colors.grid },
      },
      y: {
        type: 'linear',
        beginAtZero: spec.beginAtZero ?? false,
        title: axisTitle(spec.yTitle),
        ticks,
        grid: { color: colors.grid },
      },
      y2: {
        type: 'linear',
        display: hasY2,
        position: 'right',
        beginAtZero: spec.beginAtZero ?? hasY2,
        ...(spec.y2Max === undefined ? {} : { max: spec.y2Max }),
        title: axisTitle(spec.y2Title ?? ''),
        ticks,
        grid: { drawOnChartArea: false },
      },
    },
    plugins: {
      legend: {
        position: 'top',
        labels: {
          color: colors.text,
          boxWidth: 14,
          font: { size: 12 },
          // A band's lower edge has no entry of its own: the upper edge names the band.
          filter: (item) => !/5th percentile$/.test(item.text),
        },
      },
      tooltip: { enabled: responsive },
    },
  };
}

/** The parts of a spec that shape its options (titles, axes), as a key for reuse. */
export function optionsKey(spec: ChartSpec): string {
  return JSON.stringify([
    spec.xTitle,
    spec.yTitle,
    spec.y2Title,
    spec.beginAtZero,
    spec.xFromZero,
    spec.series.some((s) => s.axis === 'y2'),
  ]);
}
