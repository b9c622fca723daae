import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, newPage, screenshot, signInThroughForm } from './helpers/browser';

// The shell's landmarks, skip link and current-section marks, and the app's own 404 page.
let browser: Browser;
beforeAll(async () => { browser = await launchBrowser(); });
afterAll(async () => { await browser?.close(); });

describe('the app shell for keyboards and screen readers', () => {
  it('answers an unknown address with 404 and our own page, signed out', async () => {
    const { page } = await newPage(browser);
    const res = await page.goto('/this-does-not-exist');
    expect(res?.status()).toBe(404);
    await expect(page.getByRole('heading', { level: 1, name: 'No such page' }).isVisible()).resolves.toBe(true);
    await expect(page.getByRole('link', { name: 'Tonight', exact: true }).getAttribute('href')).resolves.toBe('/fleet');
    await expect(page.getByRole('link', { name: 'Sign in', exact: true }).getAttribute('href')).resolves.toBe('/sign-in');
    await screenshot(page, 'not-found-signed-out');
  });

  it('has one main landmark on the fleet page, and the first Tab lands on the skip link', async () => {
    const { page, consoleErrors } = await newPage(browser);
    await signInThroughForm(page, 'deployer@larkspur.example');
    expect(await page.getByRole('main').count()).toBe(1);
    await expect(page.getByRole('main').getAttribute('id')).resolves.toBe('main');
    // A fresh load, so focus starts at the top of the document.
    await page.reload();
    await page.keyboard.press('Tab');
    const focused = await page.evaluate(() => ({ text: document.activeElement?.textContent?.trim(), href: document.activeElement?.getAttribute('href') }));
    expect(focused).toEqual({ text: 'Skip to content', href: '#main' });
    await screenshot(page, 'fleet-skip-link-focused');
    await page.keyboard.press('Enter');
    await page.waitForFunction(() => document.activeElement?.id === 'main');
    expect(consoleErrors).toEqual([]);
  });

  it('marks Sites as the current section on /sites, and no other section', async () => {
    const { page, consoleErrors } = await newPage(browser);
    await signInThroughForm(page, 'deployer@larkspur.example');
    await page.goto('/sites');
    const rail = page.getByRole('navigation', { name: 'Main', exact: true });
    await expect(rail.getByRole('link', { name: 'Sites', exact: true }).getAttribute('aria-current')).resolves.toBe('page');
    const current = await rail.locator('a[aria-current]').evaluateAll((links) => links.map((a) => a.textContent?.trim()));
    expect(current).toEqual(['Sites']);
    await screenshot(page, 'sites-current-section');
    expect(consoleErrors).toEqual([]);
  });
});
