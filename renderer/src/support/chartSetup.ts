/**
 * chart.js, registered tree-shaken: only the scatter controller (lines between numeric
 * points) and what it needs (Filler for the Monte Carlo band), so the bundle stays small and nothing runs that we do not use.
 */
import {
  Chart,
  Filler,
  Legend,
  LinearScale,
  LineElement,
  PointElement,
  ScatterController,
  Tooltip,
} from 'chart.js';

let done = false;

export function registerCharts(): void {
  if (done) return;
  Chart.register(
    ScatterController,
    LineElement,
    PointElement,
    LinearScale,
    Legend,
    Tooltip,
    Filler,
  );
  Chart.defaults.font.family = 'system-ui, "Segoe UI", Roboto, "Helvetica Neue", Arial, sans-serif';
  done = true;
}

export { Chart };
