// unlabelledControls runs in the page: it needs the DOM types.
/// <reference lib="dom" />
/**
 * Builds the planner page with Vite, serves the build on 127.0.0.1 at a free port and opens
 * it in headless Chromium (playwright-core, system Chromium, no GPU). Shared by the browser
 * tests and scripts/measure-ui.ts.
 */
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { build, preview, type PreviewServer } from 'vite';
import { chromium, type Browser, type Page } from 'playwright-core';

export const CHROMIUM_PATH = '/usr/bin/chromium';
export const haveChromium = existsSync(CHROMIUM_PATH);

const root = fileURLToPath(new URL('../../', import.meta.url));
const configFile = fileURLToPath(new URL('../../vite.config.ts', import.meta.url));

export interface PlannerPage {
  browser: Browser;
  page: Page;
  url: string;
  close(): Promise<void>;
}

export const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-background-networking',
  '--disable-component-update',
  '--no-first-run',
  '--disable-sync',
  '--disable-quic',
];

/** `vite build` of renderer/ into a separate folder so a running dev build is not disturbed. */
export async function buildPage(outDir = 'artifacts/page'): Promise<string> {
  const out = fileURLToPath(new URL(`../../${outDir}/`, import.meta.url));
  await build({
    configFile,
    root: `${root}renderer`,
    logLevel: 'warn',
    build: { outDir: out, emptyOutDir: true },
  });
  return out;
}

export async function servePage(outDir: string): Promise<PreviewServer> {
  return preview({
    configFile,
    root: `${root}renderer`,
    logLevel: 'warn',
    build: { outDir },
    preview: { host: '127.0.0.1', port: 0, strictPort: false, open: false },
  });
}

/**
 * Builds, serves and opens the page. Test files that run side by side pass their own
 * `outDir`, so that one build never empties the folder another one serves.
 */
export async function openPlanner(
  options: { width?: number; height?: number; outDir?: string } = {},
): Promise<PlannerPage> {
  if (!haveChromium) throw new Error(`Chromium not found at ${CHROMIUM_PATH}`);
  const outDir = await buildPage(options.outDir);
  const server = await servePage(outDir);
  const url = server.resolvedUrls?.local[0];
  if (!url) throw new Error('vite preview did not report a local URL');
  const browser = await chromium.launch({
    executablePath: CHROMIUM_PATH,
    args: CHROMIUM_ARGS,
    headless: true,
  });
  const context = await browser.newContext({
    viewport: { width: options.width ?? 1280, height: options.height ?? 800 },
    deviceScaleFactor: 1,
    acceptDownloads: true,
  });
  const page = await context.newPage();
  return {
    browser,
    page,
    url,
    close: async () => {
      await browser.close();
      await new Promise<void>((resolve, reject) =>
        server.httpServer.close((e) => (e ? reject(e) : resolve())),
      );
    },
  };
}

/**
 * The planner page ready for a test: built, served and opened, its uncaught errors collected
 * into `pageErrors`, the first result on screen. Under CI a missing Chromium is an error.
 */
export async function openPlannerPage(
  options: { width?: number; height?: number; outDir?: string },
  pageErrors: string[],
): Promise<PlannerPage> {
  if (!haveChromium)
    throw new Error('CI is set but /usr/bin/chromium is missing: the browser tests cannot run.');
  const planner = await openPlanner(options);
  planner.page.on('pageerror', (e) => pageErrors.push(String(e)));
  await planner.page.goto(planner.url);
  await planner.page.waitForSelector('[data-testid="total-time"]');
  return planner;
}

/** Inputs, selects, text areas and buttons with no label a screen reader could read (outerHTML). */
export async function unlabelledControls(page: Page): Promise<string[]> {
  return page.evaluate(() =>
    [...document.querySelectorAll('input, select, textarea, button')]
      .filter((el) => {
        const e = el as HTMLInputElement;
        if (e.type === 'hidden') return false;
        const byFor = e.id && document.querySelector(`label[for="${CSS.escape(e.id)}"]`);
        const wrapped = e.closest('label');
        const aria = e.getAttribute('aria-label') || e.getAttribute('aria-labelledby');
        const text = el.tagName === 'BUTTON' && (el.textContent ?? '').trim() !== '';
        return !(byFor || wrapped || aria || text);
      })
      .map((el) => el.outerHTML.slice(0, 80)),
  );
}
