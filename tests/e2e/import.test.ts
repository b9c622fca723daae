import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb } from '@/lib/db/knex';
import { createTestNode } from '../api/helpers/fleet';
import { launchBrowser, newPage, screenshot, signInThroughForm, watchFailures } from './helpers/browser';

let browser: Browser;
beforeAll(async () => { browser = await launchBrowser(); });
afterAll(async () => { await browser?.close(); await closeDb(); });


describe('CSV import and field visits in Chromium', () => {
  it('uploads a CSV log and shows its report, then keeps it in the history', async () => {
    const { nodeId } = await createTestNode('e2e-import');
    const { page, consoleErrors } = await newPage(browser);
    const failures = watchFailures(page, [/^422 /]);
    await signInThroughForm(page, 'deployer@larkspur.example');
    await page.goto(`/nodes/${nodeId}/imports`);
    await page.getByTestId('imports-empty').waitFor();

    const base = Date.now() - 2 * 86_400_000;
    const t = (i: number) => new Date(base + i * 600_000).toISOString();
    // 4 lines: two good, one repeated time (a duplicate), one without a number.
    const csv = ['t,v', `${t(0)},4.80`, `${t(1)},4.79`, `${t(1)},4.79`, `${t(2)},lots`].join('\n');
    await page.getByLabel('CSV file').setInputFiles({ name: 'night-log.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
    await page.getByTestId('import-submit').click();
    const report = page.getByTestId('import-report');
    await report.waitFor();
    await expect(report.getByTestId('import-lines').textContent()).resolves.toBe('4');
    await expect(report.getByTestId('import-accepted').textContent()).resolves.toBe('2');
    await expect(report.getByTestId('import-duplicates').textContent()).resolves.toBe('1');
    await expect(report.getByTestId('import-rejected').textContent()).resolves.toBe('1');
    await expect(report.getByTestId('import-rejections').textContent()).resolves.toContain('line 5');
    await page.getByTestId('import-history').waitFor();
    await expect(page.getByTestId('import-row').first().textContent()).resolves.toContain('night-log.csv');
    await screenshot(page, 'import-report');

    // A file saved with semicolons and decimal commas: nothing imported, and the reason says why.
    await page.getByLabel('CSV file').setInputFiles({ name: 'comma-decimals.csv', mimeType: 'text/csv', buffer: Buffer.from(`t;v\n${t(3)};4,80\n`) });
    await page.getByTestId('import-submit').click();
    const outcome = page.getByTestId('import-report').getByTestId('import-outcome');
    await outcome.waitFor();
    await expect(outcome.getAttribute('data-word')).resolves.toBe('nothing imported');
    await expect(outcome.textContent()).resolves.toMatch(/^Nothing imported: The file seems to use semicolons.*decimal point/);
    await expect.poll(() => page.getByTestId('import-row').first().getByTestId('import-row-status').textContent()).toBe('nothing imported');
    await screenshot(page, 'import-nothing-imported');

    const phone = await newPage(browser, { width: 390, height: 844 });
    await signInThroughForm(phone.page, 'deployer@larkspur.example');
    await phone.page.goto(`/nodes/${nodeId}/imports`);
    await phone.page.getByTestId('import-history').waitFor();
    await screenshot(phone.page, 'import-report-390');
    expect(failures).toEqual([]);
    expect(consoleErrors.filter((e) => !e.startsWith('Failed to load resource'))).toEqual([]);
  });

  it('records a field visit with a photo and shows the thumbnail through the authorized route', async () => {
    const { nodeId } = await createTestNode('e2e-visit');
    const { page, consoleErrors } = await newPage(browser);
    const failures = watchFailures(page, [/^422 /]);
    await signInThroughForm(page, 'deployer@larkspur.example');
    await page.goto(`/nodes/${nodeId}/visits`);
    await page.getByTestId('visits-empty').waitFor();
    const png = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNkYPhfDwAChwGA60e6kgAAAABJRU5ErkJggg==', 'base64');
    await page.getByLabel('Work done').fill('Re-seated the antenna; cleaned the panel.');
    await page.getByLabel('Photo (optional)').setInputFiles({ name: 'mast.png', mimeType: 'image/png', buffer: png });
    await page.getByTestId('visit-submit').click();
    await page.getByTestId('visit-row').first().waitFor();
    const img = page.getByTestId('visit-photo').first();
    await expect(img.getAttribute('src')).resolves.toMatch(new RegExp(`^/api/v1/nodes/${nodeId}/visits/\\d+/photo$`));
    await expect.poll(() => img.evaluate((el) => (el as HTMLImageElement).naturalWidth)).toBe(1);

    await page.getByLabel('Work done').fill('A text file in disguise.');
    await page.getByLabel('Photo (optional)').setInputFiles({ name: 'notes.png', mimeType: 'image/png', buffer: Buffer.from('just text') });
    await page.getByTestId('visit-submit').click();
    await expect(page.getByTestId('visit-photo-error').textContent()).resolves.toBe('The photo must be a JPEG or PNG image.');
    await screenshot(page, 'visits');
    expect(failures).toEqual([]);
    expect(consoleErrors.filter((e) => !e.startsWith('Failed to load resource'))).toEqual([]);
  });
});
