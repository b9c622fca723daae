import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, newPage, screenshot, signInThroughForm } from './helpers/browser';

// Organization settings in Chromium: the owner edits, the others read (issue 7).
let browser: Browser;
beforeAll(async () => { browser = await launchBrowser(); });
afterAll(async () => { await browser?.close(); });

describe('organization settings page', () => {
  it('shows a viewer and a deployer the settings without any edit control', async () => {
    for (const role of ['viewer', 'deployer']) {
      const { page, consoleErrors } = await newPage(browser);
      await signInThroughForm(page, `${role}@larkspur.example`);
      await page.goto('/settings');
      await page.getByTestId('org-settings-view').waitFor();
      expect(await page.locator('main input, section input, section button[type="submit"]').count()).toBe(0);
      expect(await page.getByTestId('org-settings-form').count()).toBe(0);
      await expect(page.getByTestId('org-settings-view').textContent()).resolves.toContain('1.5×');
      if (role === 'viewer') await screenshot(page, 'org-settings-viewer');
      expect(consoleErrors).toEqual([]);
    }
  });

  it('lets the owner edit, showing the thresholds rule beside the field (thin must be below steady)', async () => {
    const { page, consoleErrors } = await newPage(browser);
    await signInThroughForm(page, 'owner@larkspur.example');
    await page.goto('/settings');
    await page.getByTestId('org-settings-form').waitFor();
    await page.getByLabel('thin at or above (×)').fill('1.6');
    await page.getByTestId('org-settings-save').click();
    await page.locator('#thin_margin-error').waitFor();
    await expect(page.locator('#thin_margin-error').textContent()).resolves.toContain('must be below the steady threshold');
    await screenshot(page, 'org-settings-owner-error');
    await page.getByLabel('thin at or above (×)').fill('1');
    await page.getByTestId('org-settings-save').click();
    await page.getByTestId('org-settings-message').filter({ hasText: 'Saved.' }).waitFor();
    await page.setViewportSize({ width: 390, height: 844 });
    await screenshot(page, 'org-settings-owner-phone');
    // The refused save answered locally (shared schema), so no request failed in the console.
    expect(consoleErrors).toEqual([]);
  });
});
