/**
 * A chart drawn once to an image (the printed report): an unattached canvas at a fixed
 * size and twice the pixel density, not responsive, no animation, then a PNG data URL.
 */
import { Chart } from 'chart.js';
import { chartData, chartOptions, type ChartColors } from './chartConfig.ts';
import { registerCharts } from './chartSetup.ts';
import type { ChartSpec } from './chartSpec.ts';

export function chartImage(
  spec: ChartSpec,
  colors: ChartColors,
  width = 900,
  height = 320,
): string {
  registerCharts();
  const canvas = document.createElement('canvas');
  canvas.width = width;
  canvas.height = height;
  const chart = new Chart(canvas, {
    type: 'scatter',
    data: chartData(spec, colors),
    options: { ...chartOptions(spec, colors, false), devicePixelRatio: 2 },
  });
  try {
    return canvas.toDataURL('image/png');
  } finally {
    chart.destroy();
  }
}
