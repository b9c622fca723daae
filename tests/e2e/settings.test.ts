import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, db } from '@/lib/db/knex';
import { launchBrowser, newPage, screenshot, signInThroughForm, watchFailures } from './helpers/browser';

let browser: Browser;
beforeAll(async () => { browser = await launchBrowser(); });
afterAll(async () => { await browser?.close(); await closeDb(); });


async function demoNodeId(): Promise<number> {
  const row = await db()('nodes as n').join('organizations as o', 'o.id', 'n.org_id').where('o.slug', 'larkspur-hollow').whereNull('n.deleted_at').orderBy('n.id').first('n.id');
  return row.id;
}

describe('node settings form in Chromium', () => {
  it('a deployer creates a node: figures follow the typing, a bad value gets the server’s words by its field', async () => {
    const { page, consoleErrors } = await newPage(browser);
    const failures = watchFailures(page, [/^422 /]);
    await signInThroughForm(page, 'deployer@larkspur.example');
    await page.goto('/nodes/new');
    await page.getByLabel('Name', { exact: true }).fill(`e2e-node-${Date.now()}`);
    await page.locator('#node-site').selectOption({ index: 1 });

    // The starting bank: 2 in series × 1, 100 F, 2.7 V, 15 mΩ per cell. Derived here from
    // DESIGN.md §3: C_bank = np·C/ns = 50 F, V_max = ns·Vr = 5.4 V, E = ½·C·V² = 729 J;
    // ESR_bank = ns·ESR/np = 30 mΩ, short circuit V/ESR = 180 A.
    await expect.poll(() => page.getByTestId('computed-energy').textContent()).toBe('729 J · 0.203 Wh');
    await expect.poll(() => page.getByTestId('computed-short-circuit').textContent()).toBe('180 A');
    await expect(page.getByTestId('bank-caution').textContent()).resolves.toMatch(/hundreds of amps/);

    // Doubling the cell capacitance doubles the energy (E ∝ C, derived here): 1458 J.
    await page.getByLabel('Cell capacitance (F)').fill('200');
    await expect.poll(() => page.getByTestId('computed-energy').textContent()).toBe('1458 J · 0.405 Wh');
    await expect.poll(() => page.getByTestId('computed-farads').textContent()).toBe('100 F');
    await page.getByTestId('computed-burst-floor').waitFor();
    const floor = await page.getByTestId('computed-burst-floor').textContent();
    expect(floor).toMatch(/^\d\.\d{3} V$/);
    // Currents are typed as datasheets give them (mA here) and stored in amps.
    await page.getByLabel('Burst current (mA)').fill('500');
    await expect.poll(() => page.getByTestId('computed-burst-floor').textContent()).not.toBe(floor);

    // A cutoff above the bank's maximum: only the server's cross-field check knows it.
    await page.getByLabel('Cutoff voltage (V)').fill('9');
    const refused = page.waitForResponse((r) => r.url().endsWith('/api/v1/nodes') && r.request().method() === 'POST');
    await page.getByTestId('node-save').click();
    const reply = await refused;
    expect(reply.status()).toBe(422);
    const serverWords = (await reply.json()).errors.find((e: { pointer: string }) => e.pointer === '/converter/cutoff_volts').detail;
    expect(serverWords).toBe("Must be below the bank's maximum (5.4 V).");
    await expect(page.locator('#node-converter-cutoff_volts-error').textContent()).resolves.toBe(serverWords);
    await expect(page.locator('#node-converter-cutoff_volts').getAttribute('aria-invalid')).resolves.toBe('true');
    await screenshot(page, 'settings-node-new-error');

    await page.getByLabel('Cutoff voltage (V)').fill('0.9');
    // Three cells in series: V_max = 8.1 V, C_bank = 66.7 F, E = ½·66.67·8.1² = 2187 J (derived here).
    await page.getByLabel('Cells in series (cells)').fill('3');
    await expect.poll(() => page.getByTestId('computed-max-volts').textContent()).toBe('8.10 V');
    await expect.poll(() => page.getByTestId('computed-energy').textContent()).toBe('2187 J · 0.608 Wh');
    await page.getByTestId('node-save').click();
    await page.waitForURL(/\/nodes\/\d+\/credentials\?created=1$/);
    await page.getByTestId('node-created').waitFor();
    const nodeId = Number(new URL(page.url()).pathname.split('/')[2]);
    const row = await db()('nodes').where({ id: nodeId }).first();
    expect(row).toMatchObject({ cells_series: 3, cell_farads: 200, burst_amps: 0.5, cutoff_volts: 0.9, cell_esr_ohms: 0.015, cell_leakage_amps: 0.000005 });
    expect(typeof row.efficiency === 'string' ? JSON.parse(row.efficiency) : row.efficiency).toBe(0.85);

    await page.goto(`/nodes/${nodeId}/settings`);
    await expect(page.getByLabel('Cell capacitance (F)').inputValue()).resolves.toBe('200');
    await expect(page.getByLabel('Burst current (mA)').inputValue()).resolves.toBe('500');
    await expect(page.getByLabel('Cell ESR (mΩ)').inputValue()).resolves.toBe('15');
    await expect(page.getByLabel('Efficiency (%)').inputValue()).resolves.toBe('85');
    await expect(page.getByTestId('back-to-node').getAttribute('href')).resolves.toBe(`/nodes/${nodeId}`);
    await screenshot(page, 'settings-node-edit');
    expect(failures).toEqual([]);
    expect(consoleErrors.filter((e) => !e.startsWith('Failed to load resource'))).toEqual([]);
  });

  it('reads at 390 px wide: no sideways scroll, the caution in view of the bank inputs', async () => {
    const { page, consoleErrors } = await newPage(browser, { width: 390, height: 844 });
    const failures = watchFailures(page, [/^422 /]);
    await signInThroughForm(page, 'deployer@larkspur.example');
    await page.goto(`/nodes/${await demoNodeId()}/settings`);
    await page.getByTestId('node-form').waitFor();
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await screenshot(page, 'settings-node-edit-390');
    await page.goto('/sites');
    await screenshot(page, 'settings-sites-390');
    await page.goto('/sites/new');
    await page.getByLabel('Latitude (°)').fill('91');
    await page.getByLabel('Time zone').fill('Mars/Base');
    await page.getByTestId('site-save').click();
    await expect(page.locator('#site-lat-error').textContent()).resolves.toBe('Latitude is between −90° and 90°.');
    await expect(page.locator('#site-zone-error').textContent()).resolves.toMatch(/^Not a known time zone/);
    await screenshot(page, 'settings-site-error-390');
    const siteName = `e2e-site-${Date.now()}`;
    await page.getByLabel('Name').fill(siteName);
    await page.getByLabel('Latitude (°)').fill('47.1');
    await page.getByLabel('Longitude (°)').fill('-120.5');
    await page.getByLabel('Time zone').fill('America/Los_Angeles');
    await page.getByTestId('recharge-preview').waitFor();
    await page.getByTestId('site-save').click();
    await page.waitForURL('**/sites');
    await page.getByTestId('site-row').filter({ hasText: siteName }).waitFor();
    expect(failures).toEqual([]);
    expect(consoleErrors.filter((e) => !e.startsWith('Failed to load resource'))).toEqual([]);
  });

  it('a viewer sees values, not edit controls, on settings, credentials, imports, visits and sites', async () => {
    const { page, consoleErrors } = await newPage(browser);
    const failures = watchFailures(page, [/^422 /]);
    await signInThroughForm(page, 'viewer@larkspur.example');
    const nodeId = await demoNodeId();
    const editControls = () => page.locator('input, textarea, select, button[type="submit"], [data-testid="credential-revoke"], [data-testid="site-delete"]').count();

    await page.goto(`/nodes/${nodeId}/settings`);
    await page.getByTestId('node-readonly').waitFor();
    expect(await page.getByTestId('node-form').count()).toBe(0);
    await expect(page.getByTestId('computed-short-circuit').textContent()).resolves.toMatch(/ A$/);
    expect(await editControls()).toBe(0);
    await screenshot(page, 'settings-viewer');

    for (const tab of ['credentials', 'imports', 'visits']) {
      await page.goto(`/nodes/${nodeId}/${tab}`);
      await page.getByTestId('node-name').waitFor();
      expect(await editControls(), tab).toBe(0);
      await screenshot(page, `settings-viewer-${tab}`);
    }
    await page.goto('/sites');
    expect(await page.getByTestId('site-new-link').count()).toBe(0);
    expect(await page.getByTestId('site-edit').count()).toBe(0);
    await page.getByTestId('site-row').first().locator('a').first().click();
    await page.getByTestId('site-readonly').waitFor();
    expect(await editControls()).toBe(0);
    expect(failures).toEqual([]);
    // Another organization's site, like a missing one: a real 404 before anything streams.
    const foreign = await db()('sites as s').join('organizations as o', 'o.id', 's.org_id').whereNot('o.slug', 'larkspur-hollow').first('s.id', 's.name');
    expect((await page.goto(`/sites/${foreign.id}`))?.status()).toBe(404);
    await page.getByTestId('site-not-found').waitFor();
    expect(await page.content()).not.toContain(foreign.name);
    expect((await page.goto('/sites/99999999'))?.status()).toBe(404);
    expect(consoleErrors.filter((e) => !e.startsWith('Failed to load resource'))).toEqual([]);
  });

  it('the team page fits a 390 px phone: no sideways scroll, every Remove button on screen', async () => {
    const { page, consoleErrors } = await newPage(browser, { width: 390, height: 844 });
    await signInThroughForm(page, 'owner@larkspur.example');
    await page.goto('/team');
    await page.getByTestId('member-row').first().waitFor();
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    for (const box of await page.getByRole('button', { name: 'Remove' }).evaluateAll((els) => els.map((e) => e.getBoundingClientRect().right))) {
      expect(box).toBeLessThanOrEqual(390);
    }
    await screenshot(page, 'team-390');
    expect(consoleErrors).toEqual([]);
  });
});
