import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';
import { appUrl } from '../../api/helpers/stack';

/** Debian's Chromium through playwright-core; never a downloaded browser. */
export const SCREENSHOT_DIR = path.resolve('tests/.artifacts/screenshots');

export async function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: '/usr/bin/chromium',
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'],
  });
}

export async function newPage(browser: Browser, opts: { width?: number; height?: number } = {}) {
  const context = await browser.newContext({ viewport: { width: opts.width ?? 1280, height: opts.height ?? 860 }, baseURL: appUrl() });
  const page = await context.newPage();
  const consoleErrors: string[] = [];
  page.on('console', (m) => { if (m.type() === 'error') consoleErrors.push(m.text()); });
  page.on('pageerror', (e) => consoleErrors.push(e.message));
  return { page, consoleErrors };
}

export async function screenshot(page: Page, name: string) {
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  await page.screenshot({ path: path.join(SCREENSHOT_DIR, `${name}.png`), fullPage: true });
}

export async function signInThroughForm(page: Page, email: string, password = 'duskwatch-demo') {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByTestId('sign-in-submit').click();
  await page.waitForURL('**/fleet');
}

/** Failed responses by path, so a stray 404 names itself (console errors do not say which URL). */
export function watchFailures(page: Page, allowed: RegExp[] = []) {
  const failures: string[] = [];
  page.on('response', (r) => {
    const line = `${r.status()} ${r.request().method()} ${new URL(r.url()).pathname}`;
    if (r.status() >= 400 && !allowed.some((a) => a.test(line))) failures.push(line);
  });
  return failures;
}
