// Code passed to page.evaluate runs in the page: it needs the DOM types.
/// <reference lib="dom" />
/**
 * Typing as a person types (issue 11): key by key, 60 ms between keys, into every number
 * box of the aircraft sheet, the conditions, the reserve policy, the margins and a leg of
 * each kind, in each unit preset. The box must keep exactly the typed text, no section may
 * open or close on a keystroke, and the saved plan must hold exactly the typed value
 * converted with the exact factors (core/units.ts, checked against NIST SP 811 in
 * test/core/units.test.ts). Values are drawn by fast-check from a printed seed
 * (TYPING_SEED=… reruns one).
 */
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { Page } from 'playwright-core';
import { altitudeOfPressureAltitude } from '../../core/levels.ts';
import { parsePlanText } from '../../core/plan/load.ts';
import type { Plan } from '../../core/plan/schema.ts';
import { convert, UNIT_SYSTEMS, type UnitId, type UnitSystemId } from '../../core/units.ts';
import { allFields } from '../../renderer/src/composables/usePlan.ts';
import type { NumberFieldDef } from '../../renderer/src/support/fieldTypes.ts';
import { getAtPath } from '../../renderer/src/support/paths.ts';
import { examplePlan } from '../renderer/fixtures.ts';
import { haveChromium, openPlannerPage, type PlannerPage } from './harness.ts';

const SEED = Number(process.env.TYPING_SEED ?? Date.now() % 2_147_483_647);
const KEY_DELAY_MS = 60;
const byTestId = (id: string) => `[data-testid="${id}"]`;
const demo = examplePlan('twelve-legs');
const numberDefs = new Map(
  allFields(demo)
    .filter((f): f is NumberFieldDef => f.type === 'number')
    .map((f) => [f.path, f]),
);

/** The unit a box shows in a preset (the preset table itself, core/units.ts). */
function shownUnit(def: NumberFieldDef, preset: UnitSystemId): UnitId {
  return def.quantity ? UNIT_SYSTEMS[preset][def.quantity] : def.stored;
}

async function savedPlan(page: Page): Promise<Plan> {
  const invalid = await page
    .locator('[aria-invalid="true"]')
    .evaluateAll((els) =>
      els.map((e) => `${e.getAttribute('data-testid')}="${(e as HTMLInputElement).value}"`),
    );
  const [download] = await Promise.all([
    page.waitForEvent('download', { timeout: 5000 }).catch(async () => {
      const status = await page.locator(byTestId('status')).innerText();
      const general = await page.locator(byTestId('general-issues')).allInnerTexts();
      invalid.push(...general);
      throw new Error(
        `no file saved (seed ${SEED}): ${status}; fields to fix: ${invalid.join(', ')}`,
      );
    }),
    page.click(byTestId('file-save')),
  ]);
  const loaded = parsePlanText(readFileSync(await download.path(), 'utf8'));
  if (!loaded.ok) throw new Error(`saved plan does not load: ${JSON.stringify(loaded.issues)}`);
  return loaded.plan;
}

/** Opens or closes the Units… panel by a click on its heading, whatever state it is in. */
async function showUnitSettings(page: Page, open: boolean): Promise<void> {
  const panel = page.locator(byTestId('unit-settings'));
  if ((await panel.evaluate((e) => (e as HTMLDetailsElement).open)) !== open) {
    await panel.locator('> summary').click();
  }
}

/** Opens every closed field section the way a person does: a click on its heading. */
async function openSections(page: Page): Promise<void> {
  const closed = page.locator('details.sheet-section:not([open]) > summary');
  while ((await closed.count()) > 0) await closed.first().click();
}

/** Test ids of the visible number boxes inside `scope`. */
async function numberBoxes(page: Page, scope: string): Promise<string[]> {
  return page
    .locator(`${scope} input[inputmode="decimal"]`)
    .evaluateAll((els) =>
      els
        .filter(
          (e) => (e as HTMLInputElement).offsetParent !== null && !(e as HTMLInputElement).disabled,
        )
        .map((e) => e.getAttribute('data-testid') ?? ''),
    );
}

/** Open/closed state of every field section, to compare before and after a keystroke. */
const sectionStates = (page: Page) =>
  page
    .locator('details.sheet-section')
    .evaluateAll((els) =>
      els.map((e) => `${e.getAttribute('data-testid')}:${(e as HTMLDetailsElement).open}`),
    );

/** A new value near the shown one, as a person would type it: 2–5 significant digits. */
const nearValue = fc.record({
  factor: fc.double({ min: 0.9, max: 0.999, noNaN: true }),
  digits: fc.integer({ min: 2, max: 5 }),
  fromZero: fc.integer({ min: 1, max: 40 }),
});

type Pick = { factor: number; digits: number; fromZero: number };

/** A flight level stays a level (FL270 → FL243…FL270); a number stays a number. */
function valueText(original: string, pick: Pick): string {
  const level = /^FL(\d+)$/.exec(original);
  if (level) return `FL${Math.round(Number(level[1]) * pick.factor)}`;
  return numberText(Number(original || '0'), pick);
}

function numberText(shown: number, pick: Pick): string {
  if (shown === 0) return String(pick.fromZero);
  const v = shown * pick.factor;
  const text = Number(v.toPrecision(pick.digits)).toString();
  return /e/.test(text) || text === '0' ? shown.toString() : text;
}

interface Typed {
  path: string;
  text: string;
  unit: UnitId;
}

/**
 * Types `text` into the box key by key. After every key: the box still has focus, shows the
 * text typed so far, and no section opened or closed.
 */
async function typeKeyByKey(page: Page, id: string, text: string): Promise<void> {
  const box = page.locator(byTestId(id));
  await box.click();
  await page.keyboard.press('Control+A');
  const before = await sectionStates(page);
  if (text === '') await page.keyboard.press('Delete');
  for (let i = 0; i < text.length; i++) {
    await page.keyboard.type(text[i]!, { delay: 0 });
    await page.waitForTimeout(KEY_DELAY_MS);
    const state = await box.evaluate((e) => ({
      focused: document.activeElement === e,
      value: (e as HTMLInputElement).value,
    }));
    expect(state, `${id} after "${text.slice(0, i + 1)}" (seed ${SEED})`).toEqual({
      focused: true,
      value: text.slice(0, i + 1),
    });
    expect(await sectionStates(page), `${id}: a section opened or closed`).toEqual(before);
  }
}

/** Types a value into each box; refused values are put back. Returns what the plan must hold. */
async function typeInto(page: Page, ids: string[], preset: UnitSystemId, seed: number) {
  const picks = fc.sample(nearValue, { seed, numRuns: ids.length });
  const typed: Typed[] = [];
  const refused: string[] = [];
  for (const [i, id] of ids.entries()) {
    const path = id.replace(/^field-/, '');
    const def = numberDefs.get(path);
    if (!def) continue;
    const box = page.locator(byTestId(id));
    const original = await box.inputValue();
    const text = valueText(original, picks[i]!);
    await typeKeyByKey(page, id, text);
    await page.keyboard.press('Tab');
    // Leaving the box keeps the text exactly as typed.
    expect(await box.inputValue(), `${id} after leaving it (seed ${SEED})`).toBe(text);
    if ((await box.getAttribute('aria-invalid')) === 'true') {
      // A value outside the plan's limits: the text stays with its message; then put back.
      await expect(page.locator(byTestId(`${id}-msg`)).innerText()).resolves.not.toBe('');
      refused.push(`${path}=${text}`);
      await typeKeyByKey(page, id, original);
      await page.keyboard.press('Tab');
      continue;
    }
    typed.push({ path, text, unit: shownUnit(def, preset) });
  }
  return { typed, refused };
}

function expectHolds(plan: Plan, typed: Typed[]): void {
  for (const t of typed) {
    const def = numberDefs.get(t.path)!;
    // Typed value × exact factor (core/units.ts: NIST SP 811 appendix B, 1959 yard and pound);
    // a flight level is that pressure altitude above MSL with the plan's QNH (core/levels.ts).
    const level = /^FL(\d+)$/.exec(t.text);
    const expected = level
      ? convert(
          altitudeOfPressureAltitude(Number(level[1]) * 30.48, plan.environment.qnh_Pa),
          'm',
          def.stored,
        )
      : convert(Number(t.text), t.unit, def.stored);
    const held = getAtPath(plan, t.path) as number;
    const scale = Math.max(Math.abs(expected), 1e-300);
    expect(
      Math.abs(held - expected) / scale,
      `${t.path} typed "${t.text}" ${t.unit} (seed ${SEED})`,
    ).toBeLessThan(1e-12);
  }
}

describe.runIf(haveChromium || !!process.env.CI)('typing key by key (issue 11)', () => {
  let planner: PlannerPage;
  let page: Page;
  const pageErrors: string[] = [];

  beforeAll(async () => {
    console.info(
      `test/browser/typing.test.ts: fast-check seed ${SEED} (TYPING_SEED=${SEED} reruns it)`,
    );
    planner = await openPlannerPage(
      { width: 1366, height: 900, outDir: 'artifacts/page-typing' },
      pageErrors,
    );
    page = planner.page;
  });

  afterAll(async () => {
    await planner?.close();
  });

  it('a closed section opened by a click stays open while CD0 is typed as 0.0280; undo and redo give back the text', async () => {
    await page.selectOption(byTestId('demo-picker'), 'twelve-legs');
    const polar = page.locator(byTestId('section-polar'));
    await expect(polar.evaluate((e) => (e as HTMLDetailsElement).open)).resolves.toBe(false);
    await polar.locator('> summary').click();
    const id = 'field-aircraft.polar.CD0';
    const before = await page.inputValue(byTestId(id));
    // "0.0" passes through a refused CD0 of 0 on the way: the section must not move.
    await typeKeyByKey(page, id, '0.0280');
    await page.keyboard.press('Tab');
    await expect(polar.evaluate((e) => (e as HTMLDetailsElement).open)).resolves.toBe(true);
    expect(getAtPath(await savedPlan(page), 'aircraft.polar.CD0')).toBeCloseTo(0.028, 15);
    await page.click(byTestId('undo'));
    await expect(page.inputValue(byTestId(id))).resolves.toBe(before);
    await page.click(byTestId('redo'));
    await expect(page.inputValue(byTestId(id))).resolves.toBe('0.0280');
  });

  for (const preset of ['si', 'aviation', 'uav'] as const) {
    it(`every number box of the sheet, conditions, reserves, margins and each leg kind — ${preset}`, async () => {
      await page.selectOption(byTestId('demo-picker'), 'twelve-legs');
      await page.click(`label:has(${byTestId(`unit-${preset}`)})`);
      await openSections(page);
      const sheet = await numberBoxes(page, '.pane-aircraft');
      const mission = await numberBoxes(page, '.pane-mission details.sheet-section');
      const seed = SEED + preset.length;
      const done = await typeInto(page, [...sheet, ...mission], preset, seed);
      // One leg of each kind, chosen in the leg list by a click.
      const kinds = new Set<string>();
      const rows = page.locator(byTestId('leg-row'));
      for (let i = 0; i < demo.legs.length; i++) {
        const kind = demo.legs[i]!.kind;
        if (kinds.has(kind)) continue;
        kinds.add(kind);
        await rows.nth(i).click();
        const legBoxes = await numberBoxes(page, byTestId('leg-editor'));
        const more = await typeInto(page, legBoxes, preset, seed + i + 1);
        done.typed.push(...more.typed);
        done.refused.push(...more.refused);
      }
      expect(kinds.size).toBe(6);
      expect(done.typed.length).toBeGreaterThan(30);
      if (done.refused.length)
        console.info(
          `${preset}: refused by the plan check and put back: ${done.refused.join(', ')}`,
        );
      expectHolds(await savedPlan(page), done.typed);
    }, 600_000);
  }

  it('property: a random box and a random value, typed key by key over the old one, is held exactly', async () => {
    await page.selectOption(byTestId('demo-picker'), 'twelve-legs');
    await page.click(`label:has(${byTestId('unit-aviation')})`);
    await openSections(page);
    const ids = await numberBoxes(page, '.pane-aircraft');
    await fc.assert(
      fc.asyncProperty(fc.constantFrom(...ids), nearValue, async (id, pick) => {
        const done = await typeInto(page, [id], 'aviation', Math.floor(pick.factor * 1e6));
        expectHolds(await savedPlan(page), done.typed);
      }),
      { seed: SEED, numRuns: 8 },
    );
  }, 300_000);

  it('numbers in the chosen locale: "1.500" in German is 1500 with a note, "1,5" in English is refused', async () => {
    await page.selectOption(byTestId('demo-picker'), 'twelve-legs');
    await page.click(`label:has(${byTestId('unit-si')})`);
    await page.click(`${byTestId('unit-settings')} > summary`);
    await page.selectOption(byTestId('number-locale'), 'de-DE');
    await page.click(`${byTestId('unit-settings')} > summary`);
    const id = 'field-aircraft.ceiling_m';
    await typeKeyByKey(page, id, '5.500');
    await expect(page.locator(byTestId(`${id}-note`)).innerText()).resolves.toMatch(/read as 5500/);
    await page.keyboard.press('Tab');
    // Read by the German rule: "." separates thousands (Unicode CLDR via Intl).
    expect(getAtPath(await savedPlan(page), 'aircraft.ceiling_m')).toBeCloseTo(5500, 9);
    await page.click(`${byTestId('unit-settings')} > summary`);
    await page.selectOption(byTestId('number-locale'), 'en-US');
    await page.click(`${byTestId('unit-settings')} > summary`);
    await typeKeyByKey(page, id, '5,5');
    await page.keyboard.press('Tab');
    await expect(page.locator(byTestId(`${id}-msg`)).innerText()).resolves.toMatch(
      /decimal mark is "\."/,
    );
    await expect(page.inputValue(byTestId(id))).resolves.toBe('5,5');
    await typeKeyByKey(page, id, '5500');
    await page.keyboard.press('Tab');
  });

  it('a flight level above the transition altitude is accepted in an altitude box', async () => {
    await page.click(`label:has(${byTestId('unit-aviation')})`);
    const id = 'field-aircraft.ceiling_m';
    await typeKeyByKey(page, id, 'FL250');
    await page.keyboard.press('Tab');
    await expect(page.inputValue(byTestId(id))).resolves.toBe('FL250');
    // FL250 = 25 000 ft = 7620 m pressure altitude (ft = 0.3048 m exactly, NIST SP 811;
    // flight levels: ICAO Annex 2), above MSL with the plan's QNH (core/levels.ts).
    const saved = await savedPlan(page);
    const expected = altitudeOfPressureAltitude(7620, saved.environment.qnh_Pa);
    expect(getAtPath(saved, 'aircraft.ceiling_m')).toBeCloseTo(expected, 6);
  });

  it('the unit choices are remembered after a reload', async () => {
    await page.click(`label:has(${byTestId('unit-uav')})`);
    await page.click(`${byTestId('unit-settings')} > summary`);
    await page.selectOption(byTestId('unit-choice-airspeed'), 'km_h');
    await page.reload();
    await page.waitForSelector(byTestId('total-time'));
    await expect(page.isChecked(byTestId('unit-uav'))).resolves.toBe(true);
    await page.click(`${byTestId('unit-settings')} > summary`);
    await expect(page.inputValue(byTestId('unit-choice-airspeed'))).resolves.toBe('km_h');
    await expect(page.inputValue(byTestId('unit-choice-windSpeed'))).resolves.toBe('kt');
    expect(pageErrors).toEqual([]);
  });
  it('a climb typed as a height above the departure field is saved as the altitude MSL', async () => {
    await page.selectOption(byTestId('demo-picker'), 'twelve-legs');
    await page.click(`label:has(${byTestId('unit-aviation')})`);
    await showUnitSettings(page, true);
    await page.selectOption(byTestId('altitude-reference'), 'agl');
    await showUnitSettings(page, false);
    const climb = demo.legs.findIndex((l) => l.kind === 'climb');
    await page.locator(byTestId('leg-row')).nth(climb).click();
    const id = `field-legs.${climb}.toAltitude_m`;
    await expect(page.locator(byTestId(`${id}-unit`)).innerText()).resolves.toBe('ft AGL');
    await typeKeyByKey(page, id, '3900');
    await page.keyboard.press('Tab');
    await expect(page.inputValue(byTestId(id))).resolves.toBe('3900');
    // Height AGL = altitude MSL − field elevation (definition); ft = 0.3048 m exactly (NIST
    // SP 811), so the plan holds 3900 × 0.3048 m + the departure elevation.
    const saved = await savedPlan(page);
    const expected = 3900 * 0.3048 + saved.environment.departureElevation_m;
    const stored = getAtPath(saved, `legs.${climb}.toAltitude_m`) as number;
    expect(Math.abs(stored - expected) / expected).toBeLessThan(1e-12);
    // The leg list names the reference; field elevations stay MSL.
    const summary = await page.locator(byTestId('leg-row')).nth(climb).innerText();
    expect(summary).toContain('to 3900 ft AGL');
    await openSections(page);
    await expect(
      page.locator(byTestId('field-environment.departureElevation_m-unit')).innerText(),
    ).resolves.toBe('ft MSL');
    await showUnitSettings(page, true);
    await page.selectOption(byTestId('altitude-reference'), 'msl');
    await showUnitSettings(page, false);
    await expect(page.locator(byTestId(`${id}-unit`)).innerText()).resolves.toBe('ft MSL');
    expect(pageErrors).toEqual([]);
  });
});
