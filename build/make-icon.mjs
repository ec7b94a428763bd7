#!/usr/bin/env node
/**
 * Renders build/icon.svg (drawn by hand for Legwise) to the PNGs electron-builder
 * packs: build/icon.png (512×512, macOS and Windows convert it) and build/icons/
 * {256x256,512x512}.png (Linux). Uses headless Chromium through playwright-core;
 * set CHROMIUM_PATH if it is not at /usr/bin/chromium. The PNGs are kept in the
 * repository, so this only runs when the drawing changes.
 */
import console from 'node:console';
import process from 'node:process';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium } from 'playwright-core';

const here = path.dirname(fileURLToPath(import.meta.url));
const svg = fs.readFileSync(path.join(here, 'icon.svg'));
const executablePath = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
const outputs = [
  { size: 512, file: path.join(here, 'icon.png') },
  { size: 512, file: path.join(here, 'icons', '512x512.png') },
  { size: 256, file: path.join(here, 'icons', '256x256.png') },
];

if (!fs.existsSync(executablePath)) {
  console.error(`Chromium not found at ${executablePath}; set CHROMIUM_PATH to render the icon.`);
  process.exit(1);
}
fs.mkdirSync(path.join(here, 'icons'), { recursive: true });
const browser = await chromium.launch({ executablePath, args: ['--no-sandbox'] });
try {
  for (const { size, file } of outputs) {
    const page = await browser.newPage({
      viewport: { width: size, height: size },
      deviceScaleFactor: 1,
    });
    const src = `data:image/svg+xml;base64,${svg.toString('base64')}`;
    await page.setContent(
      `<html><body style="margin:0;background:transparent"><img src="${src}" width="${size}" height="${size}"></body></html>`,
    );
    await page.locator('img').evaluate((img) => img.decode());
    await page.screenshot({
      path: file,
      omitBackground: true,
      clip: { x: 0, y: 0, width: size, height: size },
    });
    await page.close();
    console.log(`wrote ${path.relative(process.cwd(), file)}`);
  }
} finally {
  await browser.close();
}
