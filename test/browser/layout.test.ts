/**
 * Readable results on a laptop and a desktop screen, in every unit preset: no table cell or
 * totals text cut off (a cell whose content is wider than the cell, scrollWidth >
 * clientWidth, measured in the page), no "NaN" or "undefined" anywhere, and at 1366×768 the
 * verdict and the totals in the first view without scrolling. Screenshots go to
 * artifacts/screenshots/ to be looked at. Demo plans are the project's own fictional ones.
 */
import { mkdirSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { haveChromium, openPlanner, type PlannerPage } from './harness.ts';

const SHOTS = new URL('../../artifacts/screenshots/', import.meta.url);
const byTestId = (id: string) => `[data-testid="${id}"]`;

/** Unit presets offered by the switch (radio inputs `unit-<id>`). */
const PRESETS = ['si', 'aviation', 'uav'] as const;
const SCREENS = [
  { width: 1366, height: 768 },
  { width: 1920, height: 1080 },
] as const;
const DEMOS = ['twelve-legs', 'light-jet'] as const;

/**
 * Result cells and totals whose text does not fit their box (what the eye sees as
 * "57:13 …"). In the narrow leg list of the editor a long label may end in "…" only when
 * the whole text is in its tooltip.
 */
async function cutOff(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const sel =
      '.pane-outcome td, .pane-outcome th, [data-testid="verdict"] p, [data-testid="verdict"] li, [data-testid="leg-row"] span';
    return [...document.querySelectorAll<HTMLElement>(sel)]
      .filter((el) => el.offsetParent !== null && el.scrollWidth > el.clientWidth + 1)
      .filter((el) => !(el.closest('[data-testid="leg-row"]') && el.title === el.innerText))
      .map((el) => `${el.tagName.toLowerCase()}.${el.className}: "${el.innerText.slice(0, 40)}"`);
  });
}

/** Visible text containing NaN, undefined or Infinity. */
async function badText(page: Page): Promise<string[]> {
  const text = await page.locator('.app').innerText();
  return text.split('\n').filter((line) => /\bNaN\b|\bundefined\b|Infinity/.test(line));
}

/** True when the element lies fully inside the window and inside its scrolling pane. */
async function inFirstView(page: Page, selector: string): Promise<boolean> {
  return page
    .locator(selector)
    .first()
    .evaluate((el) => {
      const r = el.getBoundingClientRect();
      const pane = el.closest('.pane')?.getBoundingClientRect();
      const inWindow = r.top >= 0 && r.bottom <= window.innerHeight && r.height > 0;
      return inWindow && (!pane || (r.top >= pane.top && r.bottom <= pane.bottom));
    });
}

describe.runIf(haveChromium || !!process.env.CI)('layout at 1366×768 and 1920×1080', () => {
  let planner: PlannerPage;
  let page: Page;

  beforeAll(async () => {
    if (!haveChromium) throw new Error('CI is set but /usr/bin/chromium is missing.');
    mkdirSync(SHOTS, { recursive: true });
    planner = await openPlanner({ width: 1366, height: 768, outDir: 'artifacts/page-layout' });
    page = planner.page;
    await page.goto(planner.url);
    await page.waitForSelector(byTestId('total-time'));
  });

  afterAll(async () => {
    await planner?.close();
  });

  for (const screen of SCREENS) {
    for (const preset of PRESETS) {
      for (const demo of DEMOS) {
        it(`${demo}, ${preset}, ${screen.width}×${screen.height}: nothing cut off, no NaN`, async () => {
          await page.setViewportSize(screen);
          await page.selectOption(byTestId('demo-picker'), demo);
          // A person clicks the preset in the top bar.
          await page.locator(byTestId(`unit-${preset}`)).check({ force: true });
          await page.waitForSelector(byTestId('total-time'));
          await page.waitForTimeout(150);
          await page.screenshot({
            path: new URL(`layout-${demo}-${preset}-${screen.width}.png`, SHOTS).pathname,
          });
          expect(await cutOff(page)).toEqual([]);
          expect(await badText(page)).toEqual([]);
          const time = (await page.locator(byTestId('total-time')).innerText()).trim();
          expect(time).toMatch(/^\d+:\d\d$/); // h:mm, the one duration format
          if (screen.width === 1366) {
            // The verdict and the totals without scrolling (the laptop screen of the issue).
            expect(await inFirstView(page, byTestId('verdict-sentence'))).toBe(true);
            expect(await inFirstView(page, byTestId('totals-line'))).toBe(true);
            expect(await inFirstView(page, byTestId('landing-line'))).toBe(true);
            // …and the table's own totals row, below all twelve legs of the longest demo.
            expect(await inFirstView(page, byTestId('total-time'))).toBe(true);
          }
        });
      }
    }
  }

  it('the status line sits beside the caution, covers no field and clears itself', async () => {
    await page.setViewportSize({ width: 1366, height: 768 });
    // A person exports the table; the page says so in the status line.
    const download = page.waitForEvent('download');
    await page.getByRole('button', { name: 'CSV', exact: true }).click();
    await download;
    const status = page.locator(byTestId('status'));
    await expect(status.innerText()).resolves.toMatch(/CSV/);
    const overlaps = await status.evaluate((el) => {
      const r = el.getBoundingClientRect();
      return [
        ...document.querySelectorAll('input, select, textarea, button, [data-testid="caution"]'),
      ]
        .filter((f) => {
          const b = f.getBoundingClientRect();
          return (
            b.width > 0 &&
            r.left < b.right &&
            b.left < r.right &&
            r.top < b.bottom &&
            b.top < r.bottom
          );
        })
        .map((f) => f.outerHTML.slice(0, 60));
    });
    expect(overlaps).toEqual([]);
    // It clears itself (STATUS_CLEAR_MS = 6 s in useFiles.ts); allow twice that.
    await page.waitForFunction(
      (sel) => (document.querySelector(sel)?.textContent ?? '').trim() === '',
      byTestId('status'),
      { timeout: 12_000 },
    );
  });

  it('the altitude suggestion is a level people fly (500 ft steps) and is applied as such', async () => {
    await page.setViewportSize({ width: 1366, height: 768 });
    await page.selectOption(byTestId('demo-picker'), 'twelve-legs');
    await page.locator(byTestId('unit-aviation')).check({ force: true });
    await page.click(byTestId('tab-tune'));
    await page.click(byTestId('tune-alt-run'));
    const text = await page.locator(byTestId('tune-alt-result')).innerText({ timeout: 60_000 });
    // "6000 ft (now 3940 ft): lands with …": 500 ft levels (common practice).
    const suggested = Number(/^(\d+) ft/.exec(text)?.[1]);
    expect(suggested % 500).toBe(0);
    await page.click(byTestId('tune-alt-apply'));
    const summaries = await page.locator(`${byTestId('leg-row')} .leg-summary`).allInnerTexts();
    expect(summaries.some((t) => t.startsWith(`to ${suggested} ft`))).toBe(true);
    await page.click(byTestId('tab-profile'));
  });
});
