import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { NODE_STATES } from '@/lib/config/node-states';
import { closeDb, db } from '@/lib/db/knex';
import { deployer } from '../api/helpers/fleet';
import { appUrl } from '../api/helpers/stack';
import { launchBrowser, newPage, screenshot, signInThroughForm, watchFailures } from './helpers/browser';

// The site page's live nodes and the site form's time zone, in Debian's Chromium.
let browser: Browser;
beforeAll(async () => { browser = await launchBrowser(); });
afterAll(async () => { await browser?.close(); await closeDb(); });

/** A demo site's live nodes as the database has them (the demo seed puts three on Upper Meadow). */
async function liveNodesOf(siteName: string) {
  const site = await db()('sites as s').join('organizations as o', 'o.id', 's.org_id').where({ 'o.slug': 'larkspur-hollow', 's.name': siteName }).first('s.id');
  const nodes = await db()('nodes as n').leftJoin('node_status as st', 'st.node_id', 'n.id')
    .where({ 'n.site_id': site.id }).whereNull('n.deleted_at').select('n.id', 'n.name', 'st.volts', 'st.last_reading_at');
  return { siteId: site.id as number, nodes };
}

describe('a site page lists its live nodes', () => {
  it('names each node with a link to its page, its state by glyph and word, its last reading and bank volts', async () => {
    const { siteId, nodes } = await liveNodesOf('Upper Meadow piezometer');
    // The demo seed (simulator/fleet/demo-nodes.ts): UM-piezo-1, UM-soil-1 and UM-piezo-2, the last never reported.
    for (const name of ['UM-piezo-1', 'UM-soil-1', 'UM-piezo-2']) expect(nodes.map((n) => n.name)).toContain(name);
    const { page, consoleErrors } = await newPage(browser);
    const failures = watchFailures(page);
    await signInThroughForm(page, 'viewer@larkspur.example');
    await page.goto(`/sites/${siteId}`);
    await page.getByTestId('live-nodes').waitFor();

    const rows = page.getByTestId('live-node');
    expect(await rows.count()).toBe(nodes.length);
    for (const n of nodes) {
      const link = page.locator(`[data-testid="live-node-link"][href="/nodes/${n.id}"]`);
      expect(await link.count(), n.name).toBe(1);
      await expect(link.textContent()).resolves.toBe(n.name);
      const row = rows.filter({ has: link });
      // Shape and word (DESIGN.md §9), as on the fleet page.
      const state = (await row.getAttribute('data-state')) ?? '';
      expect(NODE_STATES, n.name).toContain(state);
      expect(await row.locator(`[data-state="${state}"] svg`).count(), n.name).toBe(1);
      expect(await row.textContent()).toContain(state);
      const reading = (await row.getByTestId('live-node-reading').textContent()) ?? '';
      if (n.last_reading_at == null) {
        expect(reading, n.name).toBe('no reading yet');
      } else {
        // The site is in Pacific time (simulator/fleet/demo-orgs.ts); volts with their unit, as the fleet writes them.
        expect(reading, n.name).toMatch(/^last reading \w{3} \d\d:\d\d P[SD]T \(\d+ (s|min|h|d) ago\) · bank \d+\.\d{3} V/);
        expect(reading, n.name).toContain(`${Number(n.volts).toFixed(3)} V`);
      }
    }
    const fresh = nodes.find((n) => n.name === 'UM-piezo-2')!;
    expect(await rows.filter({ has: page.locator(`a[href="/nodes/${fresh.id}"]`) }).getByTestId('live-node-reading').textContent()).toBe('no reading yet');
    // A viewer reads the zone with its offset now, and adds nothing.
    await expect(page.getByTestId('site-zone-offset').textContent()).resolves.toMatch(/^\(UTC−0[78]:00 now\)$/);
    await screenshot(page, 'site-live-nodes');
    expect(failures).toEqual([]);
    expect(consoleErrors).toEqual([]);

    // The name leads to the node's own page (its checks are tests/e2e/node-page.test.ts).
    const piezo = nodes.find((n) => n.name === 'UM-piezo-1')!;
    await page.locator(`[data-testid="live-node-link"][href="/nodes/${piezo.id}"]`).click();
    await page.waitForURL(`**/nodes/${piezo.id}`);
    await expect(page.getByTestId('node-name').textContent()).resolves.toBe('UM-piezo-1');
  });

  it('says how nodes are added when a site has none, and reads at 390 px without sideways scroll', async () => {
    const dep = await deployer();
    const made = await dep.agent.post('/api/v1/sites').set('origin', dep.origin)
      .send({ name: `e2e-empty-site-${process.pid}-${Date.now()}`, lat: 47.1, lon: -120.5, time_zone: 'America/Los_Angeles', recharge_elevation_deg: 3, notes: '' });
    expect(made.status).toBe(201);
    const { page, consoleErrors } = await newPage(browser, { width: 390, height: 844 });
    await signInThroughForm(page, 'deployer@larkspur.example');
    await page.goto(`/sites/${made.body.id}`);
    await expect(page.getByTestId('live-nodes-empty').textContent()).resolves.toMatch(/No nodes stand on this site yet\. Add one with New node \(this site is picked for it\)\./);
    await expect(page.getByTestId('live-nodes-add').getAttribute('href')).resolves.toBe(`/nodes/new?site=${made.body.id}`);
    expect(await page.getByTestId('live-node').count()).toBe(0);
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await screenshot(page, 'site-no-nodes-390');
    // The link opens the new-node form with this site already chosen.
    await page.getByTestId('live-nodes-add').click();
    await page.waitForURL(`**/nodes/new?site=${made.body.id}`);
    await expect(page.locator('#node-site').inputValue()).resolves.toBe(String(made.body.id));
    expect(consoleErrors).toEqual([]);
  });
});

describe('the site form’s time zone', () => {
  it('starts a new site in the browser’s zone, offers the IANA list and says each choice’s offset now', async () => {
    // A browser set to Pacific time, as a deployer in the demo valley would have it.
    const context = await browser.newContext({ viewport: { width: 1280, height: 860 }, baseURL: appUrl(), timezoneId: 'America/Los_Angeles' });
    const page = await context.newPage();
    const consoleErrors: string[] = [];
    page.on('console', (m) => { if (m.type() === 'error') consoleErrors.push(m.text()); });
    page.on('pageerror', (e) => consoleErrors.push(e.message));
    await signInThroughForm(page, 'deployer@larkspur.example');
    await page.goto('/sites/new');
    const zone = page.getByLabel('Time zone');
    await expect.poll(() => zone.inputValue()).toBe('America/Los_Angeles');
    // US Pacific time is UTC−08:00 in winter, UTC−07:00 in summer (IANA tz database, from memory).
    await expect.poll(() => page.getByTestId('site-zone-offset').textContent()).toMatch(/^UTC−0[78]:00 now · clock there \d\d:\d\d P[SD]T$/);
    expect(await page.locator('#site-zone-list option[value="UTC"]').count()).toBe(1);
    expect(await page.locator('#site-zone-list option').count()).toBeGreaterThan(300);

    // India keeps UTC+05:30 all year (IANA tz database, from memory); UTC stays a choice.
    await zone.fill('Asia/Kolkata');
    await expect.poll(() => page.getByTestId('site-zone-offset').textContent()).toMatch(/^UTC\+05:30 now/);
    await zone.fill('UTC');
    await expect.poll(() => page.getByTestId('site-zone-offset').textContent()).toMatch(/^UTC\+00:00 now/);
    await zone.fill('Mars/Base');
    await expect.poll(() => page.getByTestId('site-zone-offset').textContent()).toBe('Not a known time zone: pick one from the list.');
    await screenshot(page, 'site-form-zone');
    await context.close();
    expect(consoleErrors).toEqual([]);
  });
});
