/**
 * Child process of `npm run bench` (section 8): reads a GPX file given on the command line
 * and parses it three times, then prints one JSON line — median parse time, and the peak
 * resident memory above the process's own before the file was read. Run by bench.ts under
 * an 80 MB heap limit (--max-old-space-size=80), so finishing at all shows the import fits.
 */
import { readFileSync } from 'node:fs';
import { parseGpx } from '../core/route/gpx.ts';

const file = process.argv[2];
if (file === undefined) throw new Error('usage: gpxBench.ts FILE');
const before = process.memoryUsage().rss;
const text = readFileSync(file, 'utf8');
const times: number[] = [];
const cpu0 = process.cpuUsage();
let points = 0;
for (let i = 0; i < 3; i++) {
  const t0 = performance.now();
  const r = parseGpx(text);
  times.push(performance.now() - t0);
  if (!r.ok) throw new Error(r.issues[0]?.message);
  points = r.route.waypoints.length;
}
const cpu = process.cpuUsage(cpu0);
times.sort((a, b) => a - b);
const peak = process.resourceUsage().maxRSS * 1024;
console.log(
  JSON.stringify({
    median_ms: times[1],
    cpuPerParse_ms: (cpu.user + cpu.system) / 1000 / 3,
    waypoints: points,
    peakAbove_MB: (peak - before) / 1e6,
    text_MB: text.length / 1e6,
  }),
);
