import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, db } from '@/lib/db/knex';
import { launchBrowser, newPage as openPage, screenshot, signInThroughForm } from './helpers/browser';

let browser: Browser;
let nodeId: number;
let otherOrgNodeId: number;
beforeAll(async () => {
  browser = await launchBrowser();
  nodeId = (await db()('nodes').where({ name: 'NF-stage-1' }).first('id')).id;
  otherOrgNodeId = (await db()('nodes').where({ name: 'CF-met-1' }).first('id')).id;
});
afterAll(async () => {
  await browser?.close();
  await closeDb();
});

/**
 * The helper's page, with console errors kept apart by where they come from: until the alerts
 * API knows ?node= (issue 7, another part) it refuses the filter, the browser logs that refusal
 * as a console error, and the panel shows its empty state by design. Every other error counts.
 */
async function newPage(b: Browser, opts?: { width?: number; height?: number }) {
  const { page } = await openPage(b, opts);
  const consoleErrors: string[] = [];
  page.on('console', (m) => {
    if (m.type() === 'error' && !m.location().url.includes('/api/v1/alerts?node=')) consoleErrors.push(m.text());
  });
  page.on('pageerror', (e) => consoleErrors.push(e.message));
  return { page, consoleErrors };
}

async function openNode(page: Page, id: number) {
  await page.goto(`/nodes/${id}`);
  await page.getByTestId('node-page').waitFor();
  // uPlot draws into a canvas once the series has arrived
  await page.locator('[data-testid="chart-volts"] canvas').first().waitFor({ timeout: 20_000 });
}

describe('the node page in Chromium', () => {
  it('shows the node, draws a canvas for each chart, refetches on a range preset, without console errors', async () => {
    const { page, consoleErrors } = await newPage(browser);
    await signInThroughForm(page, 'viewer@larkspur.example');
    await openNode(page, nodeId);
    await expect(page.getByTestId('node-name').textContent()).resolves.toBe('NF-stage-1');
    expect(await page.getByTestId('node-state').locator('[data-state]').getAttribute('data-state')).toMatch(/steady|thin|short|dark|silent|new/);
    for (const chart of ['chart-volts', 'chart-energy', 'chart-panel']) {
      expect(await page.locator(`[data-testid="${chart}"] canvas`).count()).toBeGreaterThan(0);
    }
    // units on the figures and the charts' axes
    await expect(page.getByTestId('figure-volts').textContent()).resolves.toMatch(/ V/);
    await expect(page.getByTestId('figure-reserve').textContent()).resolves.toMatch(/J.*Wh/);
    await page.getByTestId('night-row').first().waitFor();
    expect(await page.getByTestId('night-row').count()).toBe(14);
    await screenshot(page, 'node-page-desktop');

    const refetch = page.waitForResponse((r) => r.url().includes(`/api/v1/nodes/${nodeId}/series?`) && r.status() === 200);
    await page.getByTestId('range-7d').click();
    const res = await refetch;
    const params = new URL(res.url()).searchParams;
    expect(Number(params.get('to')) - Number(params.get('from'))).toBe(7 * 86_400);
    await expect(page.getByTestId('range-7d').getAttribute('aria-pressed')).resolves.toBe('true');
    await page.waitForFunction(() => document.querySelector('[data-testid="series-source"]')?.textContent?.includes('10 min'));
    await screenshot(page, 'node-page-7d');
    expect(consoleErrors).toEqual([]);
  });

  it('is usable at 390 px: cards instead of the wide table, charts full width', async () => {
    const { page, consoleErrors } = await newPage(browser, { width: 390, height: 844 });
    await signInThroughForm(page, 'viewer@larkspur.example');
    await openNode(page, nodeId);
    await page.getByTestId('night-card').first().waitFor();
    expect(await page.getByTestId('night-row').first().isVisible()).toBe(false);
    const chartBox = await page.getByTestId('chart-volts').boundingBox();
    expect(chartBox!.width).toBeGreaterThan(330);
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await screenshot(page, 'node-page-390');
    expect(consoleErrors).toEqual([]);
  });

  it('tells a short node’s, a dark node’s and a new node’s story', async () => {
    const { page, consoleErrors } = await newPage(browser);
    await signInThroughForm(page, 'viewer@larkspur.example');
    for (const name of ['QR-culvert-1', 'UM-soil-1']) {
      const id = (await db()('nodes').where({ name }).first('id')).id;
      await openNode(page, id);
      await expect(page.getByTestId('tonight-sentence').textContent()).resolves.toMatch(/brown out|browned out|recharge|Quiet/);
      await page.getByTestId('night-row').first().waitFor();
      // DESIGN.md §8: the dark node browned out on a recent night; the night table says when,
      // near the floor. (QR-culvert-1 is tuned to be short at the moment the demo is seeded: when
      // that moment falls in the hours before its late recharge it has not browned out yet, so
      // its table may hold no quiet night; found in a CI run at 09:10 PST.)
      const quiet = page.locator('[data-testid="night-row"] [data-testid="night-quiet"]');
      if (name === 'UM-soil-1') {
        expect(await quiet.count(), name).toBeGreaterThan(0);
        await expect(quiet.first().textContent()).resolves.toMatch(/^browned out after \d\d:\d\d$/);
      } else if (await quiet.count()) {
        await expect(quiet.first().textContent()).resolves.toMatch(/^browned out after \d\d:\d\d$/);
      }
      await screenshot(page, `node-page-${name}`);
    }
    // a node with no reading yet: the empty state, not a broken chart
    const fresh = (await db()('nodes').where({ name: 'UM-piezo-2' }).first('id')).id;
    await page.goto(`/nodes/${fresh}`);
    await page.getByTestId('charts-empty').waitFor();
    await expect(page.getByTestId('tonight-sentence').textContent()).resolves.toContain('No reading');
    await screenshot(page, 'node-page-new');
    expect(consoleErrors).toEqual([]);
  });

  it('shows another organization’s node as not found, and a viewer no credentials tab', async () => {
    const { page } = await newPage(browser);
    await signInThroughForm(page, 'viewer@larkspur.example');
    // The node segment's layout looks the node up before anything streams: a real 404.
    const answer = await page.goto(`/nodes/${otherOrgNodeId}`);
    expect(answer?.status()).toBe(404);
    await page.getByTestId('node-not-found').waitFor();
    expect((await page.goto(`/nodes/${otherOrgNodeId}/settings`))?.status()).toBe(404);
    expect((await page.goto('/nodes/99999999'))?.status()).toBe(404);
    await page.getByTestId('node-not-found').waitFor();
    expect(await page.getByTestId('node-page').count()).toBe(0);
    expect(await page.content()).not.toContain('CF-met-1');
    await page.goto(`/nodes/${nodeId}`);
    await page.getByTestId('node-tab-overview').waitFor();
    expect(await page.getByTestId('node-tab-credentials').count()).toBe(0);
  });

  it('zooms by dragging across the bank chart and fetches the zoomed range', async () => {
    const { page, consoleErrors } = await newPage(browser);
    await signInThroughForm(page, 'deployer@larkspur.example');
    await openNode(page, nodeId);
    expect(await page.getByTestId('node-tab-credentials').count()).toBe(1);
    const over = page.locator('[data-testid="chart-volts"] .u-over');
    const box = (await over.boundingBox())!;
    const zoomed = page.waitForResponse((r) => r.url().includes('/series?') && r.status() === 200);
    await page.mouse.move(box.x + box.width * 0.3, box.y + box.height / 2);
    await page.mouse.down();
    await page.mouse.move(box.x + box.width * 0.6, box.y + box.height / 2, { steps: 8 });
    await page.mouse.up();
    const params = new URL((await zoomed).url()).searchParams;
    const span = Number(params.get('to')) - Number(params.get('from'));
    expect(span).toBeLessThan(3 * 86_400 * 0.5);
    await page.getByTestId('zoom-reset').waitFor();
    await screenshot(page, 'node-page-zoomed');
    expect(consoleErrors).toEqual([]);
  });
});
