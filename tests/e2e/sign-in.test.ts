import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoNodes } from '@/simulator/fleet/demo-fleet';
import { launchBrowser, newPage, screenshot, signInThroughForm } from './helpers/browser';

let browser: Browser;
beforeAll(async () => { browser = await launchBrowser(); });
afterAll(async () => { await browser?.close(); });

describe('signing in through the real form in Chromium', () => {
  it('shows the landing page, which leads to sign-in', async () => {
    const { page, consoleErrors } = await newPage(browser);
    await page.goto('/');
    await expect(page.getByRole('heading', { name: 'Who makes it through tonight?' }).isVisible()).resolves.toBe(true);
    await screenshot(page, 'landing');
    await page.getByTestId('landing-sign-in').click();
    await page.waitForURL('**/sign-in');
    await screenshot(page, 'sign-in');
    expect(consoleErrors).toEqual([]);
  });

  it('sends a signed-out visitor of an app page to sign-in, then back into the fleet', async () => {
    const { page, consoleErrors } = await newPage(browser);
    await page.goto('/fleet');
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await signInThroughForm(page, 'owner@larkspur.example');
    await expect(page.getByTestId('org-name').textContent()).resolves.toBe('Larkspur Hollow Watershed Trust');
    await expect(page.getByTestId('member-role').textContent()).resolves.toBe('owner');
    // Every demo node is listed (other suites may have added test nodes beside them).
    const names = await page.getByTestId('fleet-row').locator('a').allTextContents();
    for (const demo of demoNodes) expect(names).toContain(demo.name);
    await screenshot(page, 'fleet-owner');
    expect(consoleErrors).toEqual([]);
  });

  it('shows one plain message for a wrong password, and stays on sign-in', async () => {
    const { page } = await newPage(browser);
    await page.goto('/sign-in');
    await page.getByLabel('E-mail').fill('viewer@larkspur.example');
    await page.getByLabel('Password').fill('not the password at all');
    await page.getByTestId('sign-in-submit').click();
    await page.getByTestId('sign-in-error').waitFor();
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await screenshot(page, 'sign-in-error');
  });

  it('switches to the light theme and remembers it on this device', async () => {
    const { page, consoleErrors } = await newPage(browser);
    await signInThroughForm(page, 'viewer@larkspur.example');
    expect(await page.evaluate(() => document.documentElement.dataset.theme)).toBe('dark');
    const chart = page.getByTestId('fleet-chart');
    await page.waitForFunction(() => document.querySelector('[data-testid="fleet-chart"] canvas') !== null);
    const darkAxis = await chart.getAttribute('data-axis-colour');
    await page.getByTestId('theme-toggle').click();
    expect(await page.evaluate(() => document.documentElement.dataset.theme)).toBe('light');
    // The chart draws again in the light theme's colours, without a reload.
    await page.waitForFunction((before) => {
      const now = document.querySelector('[data-testid="fleet-chart"]')?.getAttribute('data-axis-colour');
      return !!now && now !== before;
    }, darkAxis);
    const lightAxis = await chart.getAttribute('data-axis-colour');
    expect(lightAxis).toBe(await page.evaluate(() => `rgb(${getComputedStyle(document.documentElement).getPropertyValue('--ink-muted').trim().split(' ').join(',')})`));
    await screenshot(page, 'fleet-light-switched');
    await page.reload();
    await page.waitForFunction(() => document.documentElement.dataset.theme === 'light');
    await screenshot(page, 'fleet-light');
    expect(consoleErrors).toEqual([]);
  });

  it('signs out', async () => {
    const { page } = await newPage(browser);
    await signInThroughForm(page, 'viewer@larkspur.example');
    await page.getByTestId('sign-out').first().click();
    await page.waitForURL('**/sign-in**');
    await page.goto('/fleet');
    expect(new URL(page.url()).pathname).toBe('/sign-in');
  });
});
