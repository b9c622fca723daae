import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, newPage, screenshot, signInThroughForm } from './helpers/browser';

// The sizing planner in Chromium: it answers and draws the longest night's discharge.
let browser: Browser;
beforeAll(async () => { browser = await launchBrowser(); });
afterAll(async () => { await browser?.close(); });

describe('the planner page', () => {
  it('answers with a count of cells and draws the night (viewer), no console errors', async () => {
    const { page, consoleErrors } = await newPage(browser);
    await signInThroughForm(page, 'viewer@larkspur.example');
    await page.goto('/planner');
    await page.getByTestId('planner-empty').waitFor();
    // The org's sites fill latitude and longitude.
    await page.getByLabel('One of your sites').selectOption({ label: 'Upper Meadow piezometer' });
    await expect(page.getByLabel('Latitude (° N)').inputValue()).resolves.toBe('47.181');
    await page.getByTestId('planner-submit').click();
    await page.getByTestId('planner-answer').waitFor({ timeout: 30_000 });
    const cells = await page.getByTestId('planner-cells-parallel').textContent();
    expect(cells).toMatch(/^\d+$/);
    await page.locator('[data-testid="planner-chart"] canvas').first().waitFor();
    const answer = await page.getByTestId('planner-answer').textContent();
    // Energy in J and Wh, the night's length, both charge times.
    for (const part of ['Energy at full', ' Wh', 'Night length', 'Charge from the panel', 'Charge at constant current', 'Night margin']) expect(answer).toContain(part);
    // The caution beside the charger fields (DESIGN.md §3).
    await expect(page.getByTestId('charger-cautions').textContent()).resolves.toContain('computer port');
    await screenshot(page, 'planner-desktop');
    expect(consoleErrors).toEqual([]);
  });

  it('puts the server\'s message beside a bad field, and works at 390 px', async () => {
    const { page, consoleErrors } = await newPage(browser, { width: 390, height: 844 });
    await signInThroughForm(page, 'deployer@larkspur.example');
    await page.goto('/planner');
    // Cutoff above the bank's maximum (2 × 2.7 V): the server names /converter/cutoff_volts.
    await page.getByLabel('Cutoff voltage (V)').fill('9');
    await page.getByTestId('planner-submit').click();
    await page.locator('#planner-converter-cutoff_volts-error').waitFor({ timeout: 30_000 });
    await expect(page.locator('#planner-converter-cutoff_volts-error').textContent()).resolves.toMatch(/cutoff|maximum|V/i);
    await screenshot(page, 'planner-phone-error');
    await page.getByLabel('Cutoff voltage (V)').fill('0.5');
    await page.getByLabel('Constant-current charger (A)').fill('1.2');
    await expect(page.getByTestId('charger-cautions').textContent()).resolves.toContain('more than a plain port gives');
    await page.getByTestId('planner-submit').click();
    await page.getByTestId('planner-answer').waitFor({ timeout: 30_000 });
    await page.locator('[data-testid="planner-chart"] canvas').first().waitFor();
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await page.getByTestId('planner-answer').scrollIntoViewIfNeeded();
    await screenshot(page, 'planner-phone');
    // Chromium logs each 4xx it receives; only the 422 asked for here may appear.
    expect(consoleErrors.filter((e) => !/status of 422/.test(e))).toEqual([]);
  });

  it('says a % bound in %, and says so when a polar night is longer than the plan (75° N in December)', async () => {
    const { page } = await newPage(browser);
    await signInThroughForm(page, 'deployer@larkspur.example');
    await page.goto('/planner');
    await page.getByLabel('Charger efficiency (%)').fill('150');
    await page.getByTestId('planner-submit').click();
    await page.locator('#planner-charger_efficiency-error').waitFor({ timeout: 30_000 });
    await expect(page.locator('#planner-charger_efficiency-error').textContent()).resolves.toBe('Must be at most 100 %.');
    await page.getByLabel('Charger efficiency (%)').fill('75');
    await page.getByLabel('Latitude (° N)').fill('75');
    await page.getByLabel('Night of (site date)').fill('2026-12-21');
    await page.getByTestId('planner-submit').click();
    await page.getByTestId('planner-polar-night').waitFor({ timeout: 30_000 });
    await expect(page.getByTestId('planner-answer').textContent()).resolves.toContain('over 7 days');
    await screenshot(page, 'planner-polar-night');
  });
});
