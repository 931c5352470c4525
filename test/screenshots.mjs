#!/usr/bin/env node
// npm run screenshots: builds if needed, serves public/ on a free port, opens the page in Debian's
// headless Chromium (playwright-core) at 1280×800 and at a 390×844 phone size, waits for the demo
// audit and its figures, and saves PNGs of the main views under screenshots/.
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium } from 'playwright-core';
import { buildIfNeeded, serve } from '../src/cli/serve.mjs';

export const CHROME_ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];

buildIfNeeded();
const server = await serve(0);
const base = `http://127.0.0.1:${server.address().port}/`;
mkdirSync('screenshots', { recursive: true });
const profile = mkdtempSync(join(tmpdir(), 'ba-shot-'));
const ctx = await chromium.launchPersistentContext(profile, { executablePath: '/usr/bin/chromium', headless: true, args: CHROME_ARGS, viewport: { width: 1280, height: 800 } });
const problems = [];
try {
  for (const [name, vp] of [['desktop', { width: 1280, height: 800 }], ['phone', { width: 390, height: 844 }]]) {
    const page = await ctx.newPage();
    page.on('console', (m) => m.type() === 'error' && problems.push(`${name}: ${m.text()}`));
    page.on('pageerror', (e) => problems.push(`${name}: ${e.message}`));
    await page.setViewportSize(vp);
    await page.goto(base);
    await page.locator('baryon-audit-app .status').filter({ hasText: 'Audited' }).waitFor({ timeout: 60000 });
    await page.waitForTimeout(500);
    await page.screenshot({ path: `screenshots/${name}-top.png` });
    await page.locator('baryon-audit-app audit-chart').first().scrollIntoViewIfNeeded();
    await page.screenshot({ path: `screenshots/${name}-figures.png` });
    await page.screenshot({ path: `screenshots/${name}-full.png`, fullPage: true });
    await page.close();
  }
} finally {
  await ctx.close();
  server.close();
  rmSync(profile, { recursive: true, force: true });
}
if (problems.length) {
  console.error(problems.join('\n'));
  process.exit(1);
}
console.log('saved screenshots/desktop-*.png and screenshots/phone-*.png');
