// Code passed to page.evaluate runs in the page: it needs the DOM types (core keeps its own
// DOM-free check in tsconfig.json).
/// <reference lib="dom" />
/**
 * The planner page in headless Chromium: what a person sees after loading a demo, editing,
 * switching units, typing a bad value, reordering and undoing. Expected numbers are computed
 * here in Node with the same core functions (solvePlan, formatQuantity), so the page must
 * show exactly what the core computes — no copy of the physics in the screen.
 */
import { mkdirSync, readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { formatQuantity } from '../../core/format.ts';
import type { Plan } from '../../core/plan/schema.ts';
import { solvePlan } from '../../core/solver/solve.ts';
import { parsePlanText } from '../../core/plan/load.ts';
import { bestSpeedForLeg } from '../../core/optimize/speedSweep.ts';
import type { UnitSystemId } from '../../core/units.ts';
import { SAMPLES_PER_LEG } from '../../renderer/src/composables/useResult.ts';
import { examplePlan } from '../renderer/fixtures.ts';
import { haveChromium, openPlannerPage, unlabelledControls, type PlannerPage } from './harness.ts';

const SHOTS = new URL('../../artifacts/screenshots/', import.meta.url);

if (!haveChromium && !process.env.CI) {
  console.warn(
    'test/browser/planner.test.ts: not run — /usr/bin/chromium is missing (install chromium to run it; in CI it fails).',
  );
}

/** The totals row as the page must show it: the header names the unit (h:mm for the time). */
function expectedTotals(plan: Plan, system: UnitSystemId) {
  const r = solvePlan(plan, { samplesPerLeg: SAMPLES_PER_LEG });
  const q = r.consumable === 'battery' ? 'energy' : 'fuelMass';
  const bare = { withUnit: false };
  return {
    time: formatQuantity(r.totals.time_s, 'time', system, bare),
    distance: formatQuantity(r.totals.groundDistance_m, 'distance', system, bare),
    used: formatQuantity(
      r.consumable === 'battery' ? r.totals.energyUsed_J : r.totals.fuelUsed_kg,
      q,
      system,
      bare,
    ),
    remaining: formatQuantity(r.landing.remaining, q, system, bare),
  };
}

const byTestId = (id: string) => `[data-testid="${id}"]`;

async function totalsOnPage(page: Page) {
  const text = (id: string) => page.locator(byTestId(id)).innerText();
  return {
    time: (await text('total-time')).trim(),
    distance: (await text('total-distance')).trim(),
    used: (await text('total-used')).trim(),
    remaining: (await text('total-remaining')).trim(),
  };
}

/** Waits until the totals cell shows `text` (the page recomputes synchronously; this only absorbs rendering). */
async function waitForTotal(page: Page, id: string, text: string): Promise<void> {
  await page
    .waitForFunction(
      ([sel, t]) => document.querySelector(sel)?.textContent?.trim() === t,
      [byTestId(id), text] as const,
      {
        timeout: 5000,
      },
    )
    .catch(() => undefined);
}

async function legIds(page: Page): Promise<string[]> {
  return page
    .locator(byTestId('leg-row'))
    .evaluateAll((rows) => rows.map((r) => r.getAttribute('data-leg-id') ?? ''));
}

/** Non-blank pixels of the chart canvas inside the figure with this test id. */
async function chartInk(page: Page, id: string): Promise<number> {
  return page.locator(`${byTestId(id)} canvas`).evaluate((canvas) => {
    const c = canvas as HTMLCanvasElement;
    const ctx = c.getContext('2d');
    if (!ctx) return 0;
    const data = ctx.getImageData(0, 0, c.width, c.height).data;
    let ink = 0;
    for (let i = 3; i < data.length; i += 4) if ((data[i] ?? 0) > 0) ink++;
    return ink;
  });
}

describe.runIf(haveChromium || !!process.env.CI)('planner page in headless Chromium', () => {
  let planner: PlannerPage;
  let page: Page;
  const pageErrors: string[] = [];
  const demo = examplePlan('twelve-legs');

  beforeAll(async () => {
    mkdirSync(SHOTS, { recursive: true });
    planner = await openPlannerPage({ width: 1280, height: 800 }, pageErrors);
    page = planner.page;
  });

  afterAll(async () => {
    await planner?.close();
  });

  it('shows the caution and labels every control', async () => {
    await expect(page.locator(byTestId('caution')).innerText()).resolves.toContain(
      'Planning estimates only',
    );
    const unlabelled = await unlabelledControls(page);
    expect(unlabelled).toEqual([]);
  });

  it('a demo plan shows the totals solvePlan computes for it', async () => {
    await page.selectOption(byTestId('demo-picker'), 'twelve-legs');
    const want = expectedTotals(demo, 'si');
    await waitForTotal(page, 'total-distance', want.distance);
    expect(await totalsOnPage(page)).toEqual(want);
    expect(await page.locator(byTestId('leg-row')).count()).toBe(demo.legs.length);
    await expect(page.locator(byTestId('verdict')).getAttribute('data-verdict')).resolves.toBe(
      solvePlan(demo).verdict,
    );
  });

  it('the charts have data and draw it', async () => {
    const profilePoints = Number(
      await page.locator(byTestId('chart-profile')).getAttribute('data-points'),
    );
    expect(profilePoints).toBeGreaterThan(demo.legs.length);
    expect(await chartInk(page, 'chart-profile')).toBeGreaterThan(1000);
    for (const [tab, chart] of [
      ['polar', 'chart-polar'],
      ['power', 'chart-power'],
      ['payload', 'chart-payload-range'],
    ] as const) {
      await page.click(byTestId(`tab-${tab}`));
      await page.waitForSelector(`${byTestId(chart)} canvas`, { timeout: 10_000 });
      expect(
        Number(await page.locator(byTestId(chart)).getAttribute('data-points')),
      ).toBeGreaterThan(0);
      expect(await chartInk(page, chart)).toBeGreaterThan(1000);
    }
    await page.click(byTestId('tab-profile'));
  });

  it('editing a cruise distance updates the totals to the new solution', async () => {
    const i = demo.legs.findIndex((l) => l.kind === 'cruise' && l.end.by === 'distance');
    const leg = demo.legs[i];
    if (leg?.kind !== 'cruise') throw new Error('the demo needs a cruise leg ending by distance');
    await page.click(`${byTestId('leg-row')}[data-leg-id="${leg.id}"]`);
    await page.fill(byTestId(`field-legs.${i}.end.distance_m`), '75');
    // 75 km typed in the SI system's distance unit (km); stored as 75 000 m.
    const edited = {
      ...demo,
      legs: demo.legs.map((l, j) =>
        j === i ? { ...leg, end: { by: 'distance' as const, distance_m: 75_000 } } : l,
      ),
    };
    const want = expectedTotals(edited, 'si');
    await waitForTotal(page, 'total-distance', want.distance);
    expect(await totalsOnPage(page)).toEqual(want);
    expect(want.distance).not.toBe(expectedTotals(demo, 'si').distance);
  });

  it('the unit switch changes labels and numbers but not the plan', async () => {
    await page.screenshot({ path: new URL('planner-si.png', SHOTS).pathname });
    const siTotals = await totalsOnPage(page);
    const ceiling = byTestId('field-aircraft.ceiling_m');
    const siCeiling = await page.inputValue(ceiling);
    await page.check(byTestId('unit-aviation'), { force: true });
    await expect(page.locator(byTestId('field-aircraft.ceiling_m-unit')).innerText()).resolves.toBe(
      'ft',
    );
    await expect(page.locator(`${byTestId('leg-table')} thead`).innerText()).resolves.toContain(
      'NM',
    );
    expect((await totalsOnPage(page)).distance).not.toBe(siTotals.distance);
    // Ceiling 4500 m shown as 14764 ft (ft = 0.3048 m exactly, NIST SP 811; 5 significant digits).
    expect(Number(await page.inputValue(ceiling))).toBeCloseTo(demo.aircraft.ceiling_m / 0.3048, 0);
    await page.screenshot({ path: new URL('planner-aviation.png', SHOTS).pathname });
    await page.check(byTestId('unit-si'), { force: true });
    expect(await totalsOnPage(page)).toEqual(siTotals);
    expect(await page.inputValue(ceiling)).toBe(siCeiling);
  });

  it('a negative mass is refused at the field, the results go stale and stay visible', async () => {
    const before = await totalsOnPage(page);
    const field = byTestId('field-aircraft.mass.empty_kg');
    await page.fill(field, '-5');
    const message = await page.locator(byTestId('field-aircraft.mass.empty_kg-msg')).innerText();
    // The limit is PlanSchema's: empty_kg from 0.01 to 500 000 kg.
    expect(message).toContain('0.01');
    expect(message).toContain('500000');
    await expect(page.locator(byTestId('stale-marker')).isVisible()).resolves.toBe(true);
    expect(await totalsOnPage(page)).toEqual(before);
    expect(await page.inputValue(field)).toBe('-5');
    await page.click(byTestId('undo'));
    await expect(page.locator(byTestId('stale-marker')).count()).resolves.toBe(0);
    expect(await page.inputValue(field)).toBe(String(demo.aircraft.mass.empty_kg));
  });

  it('Alt+ArrowUp moves the focused leg up; undo restores the order', async () => {
    const before = await legIds(page);
    const row = page.locator(`${byTestId('leg-row')}[data-leg-id="${before[3]}"]`);
    await row.focus();
    await page.keyboard.press('Alt+ArrowUp');
    const after = await legIds(page);
    expect(after[2]).toBe(before[3]);
    expect(after[3]).toBe(before[2]);
    // Focus follows the moved leg, so repeated presses keep moving it.
    await expect(
      page.evaluate(() => document.activeElement?.getAttribute('data-leg-id')),
    ).resolves.toBe(before[3]);
    await page.keyboard.press('Control+z');
    expect(await legIds(page)).toEqual(before);
    await page.keyboard.press('Control+Shift+z');
    expect(await legIds(page)).toEqual(after);
    await page.click(byTestId('undo'));
    expect(await legIds(page)).toEqual(before);
  });

  it('drag and drop moves a leg', async () => {
    const before = await legIds(page);
    const row = (id: string | undefined) => `${byTestId('leg-row')}[data-leg-id="${id}"]`;
    await page.dragAndDrop(row(before[5]), row(before[2]));
    const after = await legIds(page);
    expect(after[2]).toBe(before[5]);
    expect([...after].sort()).toEqual([...before].sort());
    await page.click(byTestId('undo'));
    expect(await legIds(page)).toEqual(before);
  });

  it('exports the leg table as CSV and saves the plan as a file', async () => {
    const [csv] = await Promise.all([
      page.waitForEvent('download'),
      page.click(byTestId('file-csv')),
    ]);
    const csvText = readFileSync(await csv.path(), 'utf8');
    const lines = csvText.trimEnd().split('\r\n');
    expect(lines[0]).toContain('Ground distance (km)');
    expect(lines).toHaveLength(1 + demo.legs.length + 1);
    const [saved] = await Promise.all([
      page.waitForEvent('download'),
      page.click(byTestId('file-save')),
    ]);
    // Plans carry our own extension (.legwise), as the desktop app's file association.
    expect(saved.suggestedFilename()).toMatch(/\.legwise$/);
    const loaded = parsePlanText(readFileSync(await saved.path(), 'utf8'));
    expect(loaded.ok).toBe(true);
    if (loaded.ok) expect(loaded.plan.legs.map((l) => l.id)).toEqual(await legIds(page));
  });

  it('a suggested speed from the Tune panel is applied with one click', async () => {
    await page.selectOption(byTestId('demo-picker'), 'twelve-legs');
    const i = demo.legs.findIndex((l) => l.kind === 'cruise');
    const best = bestSpeedForLeg(demo, i).best.tas_m_s;
    await page.click(byTestId('tab-tune'));
    await page.selectOption(byTestId('tune-leg'), demo.legs[i]?.id ?? '');
    await page.click(byTestId('tune-speed-run'));
    await page.waitForSelector(byTestId('tune-speed-apply'));
    await page.click(byTestId('tune-speed-apply'));
    await page.click(`${byTestId('leg-row')}[data-leg-id="${demo.legs[i]?.id}"]`);
    await expect(page.inputValue(byTestId(`field-legs.${i}.speed.kind`))).resolves.toBe('tas');
    const shown = Number(await page.inputValue(byTestId(`field-legs.${i}.speed.speed_m_s`)));
    // The optimizer's TAS computed here in Node, rounded to 0.1 m/s when applied.
    expect(Math.abs(shown - best)).toBeLessThanOrEqual(0.05 + 1e-9);
    await page.click(byTestId('tab-profile'));
  });

  it('the high-contrast theme can be switched on and off', async () => {
    await page.click(byTestId('contrast-toggle'));
    await expect(page.evaluate(() => document.documentElement.dataset.theme)).resolves.toBe(
      'contrast',
    );
    await page.screenshot({ path: new URL('planner-contrast.png', SHOTS).pathname });
    await page.click(byTestId('contrast-toggle'));
    await expect(page.evaluate(() => document.documentElement.dataset.theme)).resolves.toBe(
      'normal',
    );
  });

  it('unsaved work is autosaved and offered back after a reload', async () => {
    await page.fill(byTestId('field-name'), 'Autosave check');
    await page.waitForFunction(
      () => (localStorage.getItem('legwise.autosave') ?? '').includes('Autosave check'),
      undefined,
      {
        timeout: 10_000,
      },
    );
    await page.reload();
    await page.waitForSelector(byTestId('restore-yes'));
    await page.click(byTestId('restore-yes'));
    await expect(page.inputValue(byTestId('field-name'))).resolves.toBe('Autosave check');
  });

  it('raised no errors in the page', () => {
    expect(pageErrors).toEqual([]);
  });
});
