/**
 * The night theme's colours against WCAG 2.1 (relative luminance and contrast ratio,
 * https://www.w3.org/TR/WCAG21/#dfn-contrast-ratio): body text keeps at least 4.5:1 on
 * the background and the panels; it is dim (background luminance far below the day
 * theme's); and it is low in blue (in every colour blue is the smallest channel). Plus the
 * rule of which theme shows: the person's choice, else the system preference.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { appliedTheme, themeChoiceOf } from '../../renderer/src/composables/useTheme.ts';
import { NIGHT_COLORS } from '../../renderer/src/support/chartConfig.ts';

const css = readFileSync(new URL('../../renderer/src/styles/base.css', import.meta.url), 'utf8');

function block(selector: string): Record<string, string> {
  const start = css.indexOf(selector);
  if (start < 0) throw new Error(`no ${selector} in base.css`);
  const body = css.slice(css.indexOf('{', start) + 1, css.indexOf('}', start));
  const out: Record<string, string> = {};
  for (const m of body.matchAll(/--([a-z-]+):\s*(#[0-9a-f]{6})/gi))
    out[m[1] as string] = m[2] as string;
  return out;
}

function rgb(hex: string): [number, number, number] {
  const n = Number.parseInt(hex.slice(1), 16);
  return [(n >> 16) & 255, (n >> 8) & 255, n & 255];
}

/** WCAG 2.1 relative luminance (sRGB linearisation with the 0.03928 threshold). */
function luminance(hex: string): number {
  const [r, g, b] = rgb(hex).map((c) => {
    const s = c / 255;
    return s <= 0.03928 ? s / 12.92 : ((s + 0.055) / 1.055) ** 2.4;
  }) as [number, number, number];
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

function contrast(a: string, b: string): number {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x) as [number, number];
  return (hi + 0.05) / (lo + 0.05);
}

describe('night theme colours', () => {
  const night = block(":root[data-theme='night']");
  const day = block(':root {');

  it('checks WCAG’s own anchor: black on white is 21:1', () => {
    expect(contrast('#000000', '#ffffff')).toBeCloseTo(21, 6);
  });

  it('keeps text readable (≥ 4.5:1, WCAG 2.1 AA) on the background and panels', () => {
    for (const surface of ['bg', 'panel', 'accent-weak', 'tight-weak', 'fails-weak', 'ok-weak'])
      expect(contrast(night.text!, night[surface]!), surface).toBeGreaterThanOrEqual(4.5);
    expect(contrast(night.muted!, night.panel!)).toBeGreaterThanOrEqual(4.5);
    for (const state of ['ok', 'tight', 'fails', 'accent'])
      expect(contrast(night[state]!, night.panel!), state).toBeGreaterThanOrEqual(4.5);
    // Text on accent- and state-coloured badges.
    for (const fill of ['accent', 'fails', 'ok'])
      expect(contrast(night['on-accent']!, night[fill]!), fill).toBeGreaterThanOrEqual(4.5);
  });

  it('is dim: its brightest text is darker than the day background, its panels near black', () => {
    expect(luminance(night.text!)).toBeLessThan(luminance(day.bg!));
    expect(luminance(night.panel!)).toBeLessThan(0.01);
    expect(luminance(night.bg!)).toBeLessThan(luminance(day.bg!) / 50);
  });

  it('is low in blue: no colour has more blue than red or green', () => {
    const colours = [...Object.values(night), ...Object.values(NIGHT_COLORS)].filter(
      (v): v is string => typeof v === 'string',
    );
    expect(colours.length).toBeGreaterThan(15);
    for (const hex of colours) {
      const [r, g, b] = rgb(hex);
      expect(b, hex).toBeLessThanOrEqual(Math.min(r, g));
    }
  });
});

describe('which theme shows', () => {
  it('follows the system unless the person chose', () => {
    expect(appliedTheme('auto', true)).toBe('night');
    expect(appliedTheme('auto', false)).toBe('normal');
    expect(appliedTheme('day', true)).toBe('normal');
    expect(appliedTheme('contrast', true)).toBe('contrast');
    expect(appliedTheme('night', false)).toBe('night');
  });

  it('reads what earlier versions stored ("normal" was no choice)', () => {
    expect(themeChoiceOf('normal')).toBe('auto');
    expect(themeChoiceOf(null)).toBe('auto');
    expect(themeChoiceOf('contrast')).toBe('contrast');
    expect(themeChoiceOf('night')).toBe('night');
    expect(themeChoiceOf('purple')).toBe('auto');
  });
});
