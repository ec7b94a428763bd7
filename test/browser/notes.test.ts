// Code passed to page.evaluate runs in the page: it needs the DOM types.
/// <reference lib="dom" />
/**
 * The plan's notes in headless Chromium, as a person uses them: a new plan has none, typed
 * notes stay with the plan, a demo shows its own note (the text in examples/), New empties
 * them again. Expected texts come from the example files themselves. Also F1: the
 * shortcuts (the same list the desktop menu uses) and the short guide.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { examplePlan } from '../renderer/fixtures.ts';
import { SHORTCUTS, keyLabel } from '../../electron/shortcutList.ts';
import { haveChromium, openPlannerPage, type PlannerPage } from './harness.ts';

const byTestId = (id: string) => `[data-testid="${id}"]`;

describe.runIf(haveChromium || !!process.env.CI)('plan notes in the planner', () => {
  let planner: PlannerPage;
  let page: Page;
  const pageErrors: string[] = [];

  beforeAll(async () => {
    planner = await openPlannerPage(
      { width: 1280, height: 800, outDir: 'artifacts/page-notes' },
      pageErrors,
    );
    page = planner.page;
  });

  afterAll(async () => {
    await planner?.close();
  });

  it('a new plan starts with empty notes, and typed notes stay', async () => {
    await page.click(byTestId('mission-tab-notes'));
    const notes = page.locator(byTestId('field-notes'));
    expect(await notes.inputValue()).toBe('');
    await notes.click();
    await page.keyboard.type('Ridge wind picks up after 14:00.', { delay: 20 });
    await page.keyboard.press('Enter');
    await page.keyboard.type('Spare pack in the van.', { delay: 20 });
    await notes.blur();
    expect(await notes.inputValue()).toBe(
      'Ridge wind picks up after 14:00.\nSpare pack in the van.',
    );
    // Other tabs and back: the text is the plan's, not the control's.
    await page.click(byTestId('mission-tab-legs'));
    await page.click(byTestId('mission-tab-notes'));
    expect(await page.locator(byTestId('field-notes')).inputValue()).toBe(
      'Ridge wind picks up after 14:00.\nSpare pack in the van.',
    );
  });

  it('a demo plan shows its own note; New empties the notes', async () => {
    const demo = examplePlan('survey-uav-electric');
    page.once('dialog', (d) => void d.accept()); // "discard unsaved changes?" if asked
    await page.selectOption(byTestId('demo-picker'), 'survey-uav-electric');
    await page.click(byTestId('mission-tab-notes'));
    await expect.poll(() => page.locator(byTestId('field-notes')).inputValue()).toBe(demo.notes);
    page.once('dialog', (d) => void d.accept());
    await page.click(byTestId('file-new'));
    await page.click(byTestId('mission-tab-notes'));
    await expect.poll(() => page.locator(byTestId('field-notes')).inputValue()).toBe('');
    expect(pageErrors).toEqual([]);
  });

  it('F1 shows every shortcut and the guide; Escape closes it', async () => {
    await page.click(byTestId('planner-workspace'), { position: { x: 5, y: 5 } });
    await page.keyboard.press('F1');
    const panel = page.locator(byTestId('help-panel'));
    await expect.poll(() => panel.isVisible()).toBe(true);
    const rows = await page.locator(byTestId('help-shortcut')).allInnerTexts();
    expect(rows).toHaveLength(SHORTCUTS.length);
    const save = SHORTCUTS.find((s) => s.id === 'save');
    expect(rows.some((r) => r.includes(keyLabel(save?.accelerator ?? '?', false)))).toBe(true);
    expect(await page.locator(byTestId('help-guide')).innerText()).toContain('legs');
    expect(await panel.innerText()).toContain('Caution.');
    await page.keyboard.press('Escape');
    await expect.poll(() => panel.isVisible()).toBe(false);
    // And the Help button opens it again, as a person without F1 would.
    await page.click(byTestId('help-open'));
    await expect.poll(() => panel.isVisible()).toBe(true);
    await page.click(byTestId('help-close'));
    await expect.poll(() => panel.isVisible()).toBe(false);
    expect(pageErrors).toEqual([]);
  });

  it('night theme: follows the system preference, and the Night button sets it', async () => {
    const theme = () => page.evaluate(() => document.documentElement.dataset.theme);
    const background = () => page.evaluate(() => getComputedStyle(document.body).backgroundColor);
    expect(await theme()).toBe('normal');
    await page.emulateMedia({ colorScheme: 'dark' });
    await expect.poll(theme).toBe('night');
    // rgb(14, 12, 10) is --bg of the night theme (base.css).
    await expect.poll(background).toBe('rgb(14, 12, 10)');
    await page.emulateMedia({ colorScheme: 'light' });
    await expect.poll(theme).toBe('normal');
    await page.click(byTestId('night-toggle'));
    await expect.poll(theme).toBe('night');
    expect(await page.getAttribute(byTestId('night-toggle'), 'aria-pressed')).toBe('true');
    await page.screenshot({ path: 'artifacts/screenshots/planner-night.png' });
    await page.click(byTestId('night-toggle'));
    await expect.poll(theme).toBe('normal');
    expect(pageErrors).toEqual([]);
  });
});
