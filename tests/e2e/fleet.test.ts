import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { NODE_STATES } from '@/lib/config/node-states';
import { demoNodes } from '@/simulator/fleet/demo-fleet';
import { launchBrowser, newPage, screenshot, signInThroughForm } from './helpers/browser';

// The fleet page in Debian's Chromium against the running demo (issue 7, DESIGN.md §9).
const larkspurNames = demoNodes.filter((n) => n.organizationSlug === 'larkspur-hollow').map((n) => n.name);

let browser: Browser;
beforeAll(async () => { browser = await launchBrowser(); });
afterAll(async () => { await browser?.close(); });

/** Signs in through the real form, then waits until the fleet's rows are in the page. */
async function openFleet(page: Page, email: string) {
  await signInThroughForm(page, email);
  await page.getByTestId('fleet-row').first().waitFor({ state: 'attached' });
}

async function rowsOf(page: Page) {
  return page.getByTestId('fleet-row').evaluateAll((rows) =>
    rows.map((r) => ({ name: r.querySelector('a')?.textContent ?? '', state: r.getAttribute('data-state') ?? '', text: r.textContent ?? '' })));
}

describe('the fleet page', () => {
  for (const role of ['owner', 'deployer', 'viewer'] as const) {
    it(`lists the 12 demo nodes with glyph and word for the ${role}, draws the chart, no console errors`, async () => {
      const { page, consoleErrors } = await newPage(browser);
      await openFleet(page, `${role}@larkspur.example`);
      const rows = await rowsOf(page);
      for (const name of larkspurNames) expect(rows.map((r) => r.name)).toContain(name);
      for (const r of rows) {
        expect(NODE_STATES).toContain(r.state);
        // Shape and word (DESIGN.md §9): the glyph's svg and the state's word in the row.
        expect(r.text).toContain(r.state);
      }
      expect(await page.locator('[data-testid="fleet-row"] [data-state] svg').count()).toBe(rows.length);
      // The answer first: counts per state and the earliest projected brownout.
      const counted = await Promise.all(NODE_STATES.map(async (s) => Number(await page.getByTestId(`count-${s}`).locator('.figures').textContent())));
      expect(counted.reduce((a, b) => a + b, 0)).toBe(rows.length);
      await expect(page.getByTestId('earliest-brownout').textContent()).resolves.toMatch(/brownout|No node/);
      // Most at risk first: the first row is short when any node is (DESIGN.md §4 order).
      if (counted[NODE_STATES.indexOf('short')] > 0) expect(rows[0].state).toBe('short');
      await page.locator('[data-testid="fleet-chart"] canvas').first().waitFor({ timeout: 15_000 });
      expect(await page.getByTestId('add-node').count()).toBe(role === 'viewer' ? 0 : 1);
      await screenshot(page, `fleet-${role}-desktop`);
      expect(consoleErrors).toEqual([]);
    });
  }

  it('filters by state and by site, and searches', async () => {
    const { page, consoleErrors } = await newPage(browser);
    await openFleet(page, 'deployer@larkspur.example');
    const all = (await rowsOf(page)).length;
    const thinCount = Number(await page.getByTestId('count-thin').locator('.figures').textContent());
    await page.getByLabel('State', { exact: true }).selectOption('thin');
    const thin = await rowsOf(page);
    expect(thin.length).toBe(thinCount);
    expect(thin.every((r) => r.state === 'thin')).toBe(true);
    // The count tiles toggle the same filter.
    await page.getByTestId('count-thin').click();
    expect((await rowsOf(page)).length).toBe(all);
    await page.getByTestId('count-short').click();
    expect((await rowsOf(page)).every((r) => r.state === 'short')).toBe(true);
    await page.getByTestId('count-short').click();
    await page.getByLabel('Site', { exact: true }).selectOption({ label: 'Quarry Road culvert' });
    const quarry = await rowsOf(page);
    expect(quarry.map((r) => r.name).sort()).toEqual(larkspurNames.filter((n) => n.startsWith('QR-')).sort());
    await page.getByLabel('Site', { exact: true }).selectOption('');
    await page.getByLabel('Search', { exact: true }).fill('um-piezo');
    expect((await rowsOf(page)).map((r) => r.name).sort()).toEqual(['UM-piezo-1', 'UM-piezo-2']);
    await page.getByLabel('Search', { exact: true }).fill('no such node anywhere');
    await page.getByTestId('fleet-no-match').waitFor();
    await screenshot(page, 'fleet-no-match');
    await page.getByRole('button', { name: 'Clear the filters' }).click();
    expect((await rowsOf(page)).length).toBe(all);
    // Sorting by name from the table header.
    await page.getByTestId('sort-name').click();
    const names = (await rowsOf(page)).map((r) => r.name);
    expect(names).toEqual([...names].sort((a, b) => a.localeCompare(b)));
    expect(consoleErrors).toEqual([]);
  });

  it('shows cards instead of the table at 390 px', async () => {
    const { page, consoleErrors } = await newPage(browser, { width: 390, height: 844 });
    await signInThroughForm(page, 'viewer@larkspur.example');
    // The sign-in form navigates on the client: wait for the fleet's cards to be drawn.
    await page.getByTestId('fleet-card').first().waitFor();
    expect(await page.getByTestId('fleet-table').isVisible()).toBe(false);
    const cards = page.getByTestId('fleet-card');
    expect(await cards.count()).toBeGreaterThanOrEqual(12);
    expect(await cards.first().isVisible()).toBe(true);
    // Nothing wider than the phone: no sideways scrolling of the page.
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await page.locator('[data-testid="fleet-chart"] canvas').first().waitFor({ timeout: 15_000 });
    await screenshot(page, 'fleet-viewer-phone');
    expect(consoleErrors).toEqual([]);
  });

  it('refreshes by polling the fleet API without a reload', async () => {
    const { page } = await newPage(browser);
    await signInThroughForm(page, 'viewer@larkspur.example');
    const marker = await page.evaluate(() => { (window as unknown as { __marker: number }).__marker = 42; return 42; });
    const res = await page.waitForResponse((r) => new URL(r.url()).pathname === '/api/v1/fleet' && r.status() === 200, { timeout: 45_000 });
    expect((await res.json()).nodes.length).toBeGreaterThanOrEqual(12);
    // Same document: the page was not reloaded.
    expect(await page.evaluate(() => (window as unknown as { __marker?: number }).__marker)).toBe(marker);
  }, 60_000);
});
