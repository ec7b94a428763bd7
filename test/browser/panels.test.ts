// Code passed to page.evaluate runs in the page: it needs the DOM types.
/// <reference lib="dom" />
/**
 * The route, winds-aloft, airfield and Confidence panels and the printed report in headless
 * Chromium. Expected numbers come from the same core functions run here in Node (parseGpx,
 * parseWindsText, solvePlan, the Monte Carlo aggregation), so the page must show what the
 * core computes.
 */
import { mkdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { parseGpx } from '../../core/route/gpx.ts';
import { parseWindsText } from '../../core/weather/parseWindsText.ts';
import { formatQuantity } from '../../core/format.ts';
import { spreadsFromDefaults } from '../../core/uncertainty/spreads.ts';
import { createConfidenceRun } from '../../renderer/src/support/confidence.ts';
import { keptSentence } from '../../renderer/src/support/confidenceText.ts';
import { examplePlan } from '../renderer/fixtures.ts';
import { loggerTrackGpx } from '../support/gpxSynth.ts';
import { haveChromium, openPlanner, unlabelledControls, type PlannerPage } from './harness.ts';

const SHOTS = new URL('../../artifacts/screenshots/', import.meta.url);
const ARTIFACTS = new URL('../../artifacts/', import.meta.url);
const GPX = fileURLToPath(new URL('../fixtures/gpx/route.gpx', import.meta.url));
const BAD_GPX = fileURLToPath(new URL('../fixtures/gpx/bad-lat.gpx', import.meta.url));
const byTestId = (id: string) => `[data-testid="${id}"]`;
const shot = (page: Page, name: string) =>
  page.screenshot({ path: fileURLToPath(new URL(name, SHOTS)) });

describe.runIf(haveChromium || !!process.env.CI)(
  'route, weather, airfield and confidence panels',
  () => {
    let planner: PlannerPage;
    let page: Page;
    const pageErrors: string[] = [];
    const demo = examplePlan('twelve-legs');

    beforeAll(async () => {
      if (!haveChromium)
        throw new Error(
          'CI is set but /usr/bin/chromium is missing: the browser tests cannot run.',
        );
      mkdirSync(SHOTS, { recursive: true });
      planner = await openPlanner({ width: 1280, height: 800, outDir: 'artifacts/page-panels' });
      page = planner.page;
      page.on('pageerror', (e) => pageErrors.push(String(e)));
      await page.goto(planner.url);
      await page.waitForSelector(byTestId('total-time'));
      await page.selectOption(byTestId('demo-picker'), 'twelve-legs');
      await page.waitForSelector(`${byTestId('leg-row')}:nth-child(${demo.legs.length})`);
    });

    afterAll(async () => {
      await planner?.close();
    });

    it('a GPX file with a bad point is refused with the element and line named', async () => {
      await page.click(byTestId('mission-tab-route'));
      await page.setInputFiles(byTestId('gpx-file'), BAD_GPX);
      const read = parseGpx(readFileSync(BAD_GPX, 'utf8'));
      if (read.ok) throw new Error('the fixture must be refused');
      const shown = await page.locator(byTestId('gpx-issues')).innerText();
      expect(shown).toContain(read.issues[0]?.message ?? '');
      expect(shown).toMatch(/line \d+/);
      expect(await page.locator(byTestId('waypoint-row')).count()).toBe(0);
    });

    it('a large logger file shows its progress and can be cancelled, leaving the route as it was', async () => {
      const big = fileURLToPath(new URL('logger-190k.gpx', ARTIFACTS));
      mkdirSync(fileURLToPath(ARTIFACTS), { recursive: true });
      writeFileSync(big, loggerTrackGpx(190_000, 5, { climbBias: 0.5, stepScale: 0.2 }));
      await page.setInputFiles(byTestId('gpx-file'), big);
      const progress = page.locator(byTestId('gpx-progress'));
      await expect(progress.innerText()).resolves.toMatch(/^Reading logger-190k\.gpx … \d+ %/);
      await page.click(byTestId('gpx-cancel'));
      await expect(page.locator(byTestId('route-note')).innerText()).resolves.toBe(
        'Import of logger-190k.gpx cancelled; the route is unchanged.',
      );
      expect(await page.locator(byTestId('waypoint-row')).count()).toBe(0);
      // Read to the end this time: the track thinned to at most 100 waypoints (core/route/gpx.ts).
      await page.setInputFiles(byTestId('gpx-file'), big);
      await expect(
        page.locator(byTestId('route-note')).innerText({ timeout: 30_000 }),
      ).resolves.toMatch(/^\d+ waypoints read from logger-190k\.gpx/);
      const n = await page.locator(byTestId('waypoint-row')).count();
      expect(n).toBeGreaterThan(50);
      expect(n).toBeLessThanOrEqual(100);
      await page.click(byTestId('route-remove'));
    });

    it('imports a GPX route, shows its waypoints and builds a leg to each', async () => {
      await page.setInputFiles(byTestId('gpx-file'), GPX);
      const read = parseGpx(readFileSync(GPX, 'utf8'));
      if (!read.ok) throw new Error('the fixture must be read');
      const rows = page.locator(byTestId('waypoint-row'));
      // The file is read in a worker: wait for the note that says it is done.
      await expect(page.locator(byTestId('route-note')).innerText()).resolves.toContain(
        `${read.route.waypoints.length} waypoints read`,
      );
      await expect(rows.count()).resolves.toBe(read.route.waypoints.length);
      const names = await rows.evaluateAll((trs) =>
        trs.map((tr) => (tr.querySelector('input') as HTMLInputElement).value),
      );
      expect(names).toEqual(read.route.waypoints.map((w) => w.name));
      // Latitudes as typed in the file (plain degrees, no conversion).
      expect(Number(await page.inputValue(byTestId('field-route.waypoints.0.lat_deg')))).toBe(
        read.route.waypoints[0]?.lat_deg,
      );
      await expect(page.locator(byTestId('gpx-warnings')).innerText()).resolves.toContain(
        'only the first',
      );

      await page.click(byTestId('route-build'));
      await expect(page.locator(byTestId('route-note')).innerText()).resolves.toContain(
        '2 cruise legs',
      );
      await page.click(byTestId('mission-tab-legs'));
      const legCount = demo.legs.length + read.route.waypoints.length - 1;
      await expect(page.locator(byTestId('leg-row')).count()).resolves.toBe(legCount);
      const titles = await page.locator(byTestId('leg-title')).allInnerTexts();
      expect(titles).toContain('To Ridge → north');
      expect(titles).toContain('To Lake');

      await page.click(byTestId('mission-tab-route'));
      await page.click(byTestId('tab-route'));
      const svg = page.locator(byTestId('route-svg'));
      // The fixture route: 3 waypoints, 2 legs flying to them.
      await expect(svg.getAttribute('data-segments')).resolves.toBe('2');
      await expect(page.locator(byTestId('route-waypoint')).count()).resolves.toBe(3);
      await expect(page.locator(byTestId('route-legs')).innerText()).resolves.toMatch(
        /OK|Tight|Fails/,
      );
      await expect(page.locator(byTestId('route-scale')).textContent()).resolves.toMatch(/\d+ km/);
      await shot(page, 'route.png');
    });

    it('exports the route as GPX with an estimate at every waypoint', async () => {
      const [file] = await Promise.all([
        page.waitForEvent('download'),
        page.click(byTestId('route-export')),
      ]);
      expect(file.suggestedFilename()).toMatch(/\.gpx$/);
      const text = readFileSync(await file.path(), 'utf8');
      const back = parseGpx(text);
      // One route point with an estimate for each of the fixture's 3 waypoints.
      expect(back.ok && back.route.waypoints.length).toBe(3);
      expect(text.match(/<lw:eta_s>/g)).toHaveLength(3);
      expect(text.match(/<lw:fuel_kg>/g)).toHaveLength(3);
    });

    it('pasted winds fill the table in the current units and bad lines are named', async () => {
      await page.click(byTestId('mission-tab-winds'));
      const text = 'ft deg kt C\n3000 270 15 9\n6000 280 22 3\n9000 290 thirty -3\n';
      await page.fill(byTestId('winds-text'), text);
      const read = parseWindsText(text);
      await expect(page.locator(byTestId('winds-issues')).innerText()).resolves.toContain(
        read.issues[0]?.message ?? '',
      );
      await page.click(byTestId('winds-use'));
      const rows = page.locator(byTestId('winds-row'));
      await expect(rows.count()).resolves.toBe(read.levels.length);
      // 3000 ft = 914.4 m (ft = 0.3048 m exactly, NIST SP 811): exact, so shown in full in m.
      expect(await page.inputValue(byTestId('field-environment.windsAloft.0.altitude_m'))).toBe(
        '914.4',
      );
      expect(await page.inputValue(byTestId('field-environment.windsAloft.1.from_deg'))).toBe(
        '280',
      );
      // 22 kt = 11.3178 m/s (kt = 1852/3600 m/s exactly), 3 significant digits in the box.
      expect(await page.inputValue(byTestId('field-environment.windsAloft.1.speed_m_s'))).toBe(
        '11.3',
      );
      // The temperature column shows what was pasted, back from the ISA deviation (1976 Standard Atmosphere).
      expect(await page.locator(byTestId('winds-temperature')).first().innerText()).toBe(
        formatQuantity(9 + 273.15, 'temperature', 'si'),
      );
      await shot(page, 'winds-aloft.png');
    });

    it('a runway far too short makes the take-off check fail in the verdict', async () => {
      await page.click(byTestId('mission-tab-airfield'));
      await page.selectOption(byTestId('field-airfield.departure.by'), 'runway');
      await page.fill(byTestId('field-aircraft.field.propDiameter_m'), '1.2');
      await page.fill(byTestId('field-airfield.departure.available_m'), '800');
      const check = page.locator(`${byTestId('airfield-checks')} [data-check-id="takeoffRun"]`);
      await expect(check.getAttribute('data-state')).resolves.not.toBe('fails');
      // 20 m: far below the take-off distance to 15 m of a 150 kg aircraft (from memory).
      await page.fill(byTestId('field-airfield.departure.available_m'), '20');
      await expect(check.getAttribute('data-state')).resolves.toBe('fails');
      const verdict = page.locator(`${byTestId('verdict')} [data-check-id="takeoffRun"]`);
      await expect(verdict.getAttribute('data-state')).resolves.toBe('fails');
      await expect(page.locator(byTestId('verdict')).getAttribute('data-verdict')).resolves.toBe(
        'fails',
      );
      await expect(check.innerText()).resolves.toContain('20 m of runway');
      await shot(page, 'airfield.png');
    });

    it('the Monte Carlo runs in the page and says how often the reserve is kept', async () => {
      const electric = examplePlan('survey-uav-electric');
      await page.selectOption(byTestId('demo-picker'), 'survey-uav-electric');
      await page.click(byTestId('tab-confidence'));
      await page.fill(byTestId('field-uncertainty.samples'), '200');
      await page.click(byTestId('confidence-run'));
      const sentence = page.locator(byTestId('confidence-sentence'));
      await sentence.waitFor({ timeout: 30_000 });
      // The same run in Node: the demo with the default spreads, 200 samples, random seed 1.
      const plan = {
        ...electric,
        uncertainty: { ...spreadsFromDefaults(electric), samples: 200, seed: 1 },
      };
      const run = createConfidenceRun(plan, spreadsFromDefaults(electric), {
        samples: 200,
        seed: 1,
      });
      while (!run.step(50));
      expect((await sentence.innerText()).trim()).toBe(keptSentence(run.result()));
      await expect(
        page.locator(byTestId('confidence-ranked')).locator('li').count(),
      ).resolves.toBeGreaterThan(0);
      await shot(page, 'confidence.png');

      await page.click(byTestId('tab-profile'));
      await page.waitForSelector(byTestId('profile-band-note'));
      // Altitude, leg ends, charge, and the band's two edges.
      await expect(
        page.locator(byTestId('chart-profile')).getAttribute('data-series'),
      ).resolves.toBe('5');
      await shot(page, 'profile-band.png');
    });

    it('prints the report with the leg table and the caution; saves it as PDF', async () => {
      await page.evaluate(() => window.dispatchEvent(new Event('legwise:prepare-print')));
      await page.emulateMedia({ media: 'print' });
      const report = page.locator(byTestId('report'));
      await expect(report.isVisible()).resolves.toBe(true);
      await expect(page.locator(byTestId('planner-workspace')).isVisible()).resolves.toBe(false);
      const legs = examplePlan('survey-uav-electric').legs.length;
      await expect(report.locator(byTestId('report-result-row')).count()).resolves.toBe(legs);
      await expect(report.innerText()).resolves.toContain('Planning estimates only');
      // The Monte Carlo of the test before belongs to this plan: its sentence is in the report.
      await expect(report.locator(byTestId('report-confidence')).innerText()).resolves.toContain(
        'simulated flights',
      );
      await page.screenshot({
        path: fileURLToPath(new URL('report-print.png', SHOTS)),
        fullPage: true,
      });
      const pdf = fileURLToPath(new URL('report.pdf', ARTIFACTS));
      await page.pdf({ path: pdf, format: 'A4', printBackground: true });
      expect(readFileSync(pdf).subarray(0, 5).toString('latin1')).toBe('%PDF-');
      // An A4 page with text and a chart image is well above 20 kB (from memory).
      expect(statSync(pdf).size).toBeGreaterThan(20_000);
      await page.emulateMedia({ media: 'screen' });
      await page.evaluate(() => window.dispatchEvent(new Event('legwise:print-done')));
      await expect(report.count()).resolves.toBe(0);
    });

    it('labels every control of the new panels', async () => {
      const missing: string[] = [];
      for (const tab of ['route', 'winds', 'airfield']) {
        await page.click(byTestId(`mission-tab-${tab}`));
        for (const chart of ['route', 'confidence']) {
          await page.click(byTestId(`tab-${chart}`));
          missing.push(...(await unlabelledControls(page)));
        }
      }
      expect(missing).toEqual([]);
    });

    it('raised no errors in the page', () => {
      expect(pageErrors).toEqual([]);
    });
  },
);
