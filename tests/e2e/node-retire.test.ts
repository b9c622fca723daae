import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb } from '@/lib/db/knex';
import { createTestNode } from '../api/helpers/fleet';
import { appUrl } from '../api/helpers/stack';
import { launchBrowser, newPage, screenshot, signInThroughForm, watchFailures } from './helpers/browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await closeDb();
});

async function postReading(token: string, volts: number) {
  const res = await fetch(`${appUrl()}/api/v1/readings`, {
    method: 'POST',
    headers: { authorization: `Bearer ${token}`, 'content-type': 'application/json' },
    body: JSON.stringify({ v: volts }),
  });
  expect(res.status).toBe(200);
}

describe('a node over its rating, then retired, in Chromium', () => {
  it('shows the over-voltage caution with the real figure on the node page and the fleet; retiring takes it off the fleet', async () => {
    const node = await createTestNode('e2e-over');
    const rated = node.body.bank.cells_series * node.body.bank.cell_rated_volts;
    const volts = Number((rated * 1.5).toFixed(2));
    await postReading(node.token, volts);

    const { page } = await newPage(browser);
    // After the retirement, the node's own page (and any poll still in flight) answers 404 by design.
    const failures = watchFailures(page, [/^404 GET \/(api\/v1\/)?nodes\/\d+/]);
    await signInThroughForm(page, 'deployer@larkspur.example');
    await page.goto(`/nodes/${node.nodeId}`);
    const caution = page.getByTestId('over-voltage-caution');
    await caution.waitFor();
    const text = (await caution.textContent()) ?? '';
    expect(text).toContain(`${volts.toFixed(2)} V, ${Math.round((100 * volts) / rated)} % of its rated ${rated.toFixed(2)} V`);
    expect(text).toMatch(/local electrical codes/);
    await screenshot(page, 'node-over-voltage');

    await page.goto('/fleet');
    const row = page.locator('[data-testid="fleet-row"]', { hasText: node.body.name });
    await row.getByTestId('over-voltage').waitFor();
    // …and above the table, as a hazard, whatever the node's margin.
    await expect(page.getByTestId('fleet-over-voltage').filter({ hasText: node.body.name }).textContent()).resolves.toContain(`${Math.round((100 * volts) / rated)} % of its rated`);
    expect(await row.getByTestId('over-voltage').textContent()).toContain(`${Math.round((100 * volts) / rated)} % of rated`);

    await page.goto(`/nodes/${node.nodeId}/settings`);
    await page.getByTestId('node-retire').click();
    await page.getByTestId('node-retire-confirm').click();
    await page.waitForURL('**/fleet');
    await page.locator('[data-testid="fleet-row"]').first().waitFor();
    expect(await page.locator('[data-testid="fleet-row"]', { hasText: node.body.name }).count()).toBe(0);
    expect((await page.goto(`/nodes/${node.nodeId}`))?.status()).toBe(404);
    // The record stays: its site lists it as retired, with when.
    await page.goto(`/sites/${node.body.site_id}`);
    await expect(page.getByTestId('retired-node').filter({ hasText: node.body.name }).textContent()).resolves.toMatch(/retired .* · last reading /);
    // …and its readings can still be downloaded from there, all of them.
    const href = await page.getByTestId('retired-node').filter({ hasText: node.body.name }).getByTestId('retired-node-export').getAttribute('href');
    const csv = await page.request.get(href!);
    expect(csv.status()).toBe(200);
    const lines = (await csv.text()).split('\r\n').filter(Boolean);
    expect(lines).toHaveLength(2);
    expect(Number(lines[1].split(',')[1])).toBeCloseTo(volts, 3);
    await page.getByTestId('retired-nodes').scrollIntoViewIfNeeded();
    await screenshot(page, 'site-retired-nodes');
    // Its credential stopped working with it.
    const after = await fetch(`${appUrl()}/api/v1/readings`, {
      method: 'POST', headers: { authorization: `Bearer ${node.token}`, 'content-type': 'application/json' }, body: JSON.stringify({ v: 3 }),
    });
    expect(after.status).toBe(401);
    expect(failures).toEqual([]);
  });
});
