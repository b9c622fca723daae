import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, newPage, screenshot, signInThroughForm } from './helpers/browser';

// The bench in Chromium: a deployer uploads a cell's log and sees its report; a viewer reads.
// Synthetic IEC 62391-1 class-2 log (REFERENCES.md): 10 F, 2.7 V, I = 10.8 mA; here a weak 7 F cell.
function csvLog({ farads, esrOhms }: { farads: number; esrOhms: number }): string {
  const amps = 0.0108;
  const lines = ['seconds,volts', '0,2.7'];
  for (let t = 1; ; t++) {
    const volts = 2.7 - amps * esrOhms - (amps * t) / farads;
    if (volts < 0.9) break;
    lines.push(`${t},${volts.toFixed(6)}`);
  }
  return lines.join('\n') + '\n';
}

let browser: Browser;
beforeAll(async () => { browser = await launchBrowser(); });
afterAll(async () => { await browser?.close(); });

const batch = `e2e-${Date.now()}`;

describe('the bench page', () => {
  it('uploads a weak cell and shows its report and the flagged batch (deployer)', async () => {
    const { page, consoleErrors } = await newPage(browser);
    await signInThroughForm(page, 'deployer@larkspur.example');
    await page.goto('/bench');
    await expect(page.getByTestId('bench-method').textContent()).resolves.toContain('IEC 62391-1');
    await page.getByLabel('Batch label').fill(batch);
    await page.getByLabel('Cell label').fill('C7');
    await page.getByLabel(/Discharge log/).setInputFiles({ name: 'c7.csv', mimeType: 'text/csv', buffer: Buffer.from(csvLog({ farads: 7, esrOhms: 0.08 })) });
    await page.getByTestId('bench-submit').click();
    await page.getByTestId('bench-report').waitFor({ timeout: 20_000 });
    // C = I·(t2 − t1)/(V1 − V2) recovers the 7 F put in (IEC 62391-1; derived here), 70 % of 10 F: flagged.
    await expect(page.getByTestId('report-capacitance').textContent()).resolves.toBe('7.00 F');
    await expect(page.getByTestId('report-esr').textContent()).resolves.toBe('80.0 mΩ');
    await expect(page.getByTestId('bench-report').textContent()).resolves.toContain('low capacitance');
    const row = page.getByTestId('bench-batch').filter({ hasText: batch }).getByTestId('bench-cell');
    await row.first().waitFor();
    await expect(row.first().getAttribute('data-flagged')).resolves.toBe('yes');
    await screenshot(page, 'bench-deployer-desktop');
    // A file without the header: the server's line message beside the file input.
    await page.getByLabel('Cell label').fill('C8');
    await page.getByLabel(/Discharge log/).setInputFiles({ name: 'bad.csv', mimeType: 'text/csv', buffer: Buffer.from('t,v\n0,2.7\n') });
    await page.getByTestId('bench-submit').click();
    await page.locator('#bench-file-error').waitFor();
    await expect(page.locator('#bench-file-error').textContent()).resolves.toContain('seconds,volts');
    // Chromium logs each 4xx it receives; only the 422 asked for here may appear.
    expect(consoleErrors.filter((e) => !/status of 422/.test(e))).toEqual([]);
  });

  it('shows a viewer the batches and no upload form, at desktop and 390 px', async () => {
    const { page, consoleErrors } = await newPage(browser, { width: 390, height: 844 });
    await signInThroughForm(page, 'viewer@larkspur.example');
    await page.goto('/bench');
    await page.getByTestId('bench-method').waitFor();
    expect(await page.getByTestId('bench-form').count()).toBe(0);
    expect(await page.locator('input[type="file"]').count()).toBe(0);
    await page.getByTestId('bench-batch').filter({ hasText: batch }).waitFor();
    // Phone: cards instead of the wide table, and nothing wider than the screen.
    expect(await page.getByTestId('bench-batch').filter({ hasText: batch }).getByTestId('bench-cell-card').first().isVisible()).toBe(true);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await screenshot(page, 'bench-viewer-phone');
    await page.setViewportSize({ width: 1280, height: 860 });
    await screenshot(page, 'bench-viewer-desktop');
    expect(consoleErrors).toEqual([]);
  });
});
