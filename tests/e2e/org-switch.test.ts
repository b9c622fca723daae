import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { newOneTimeToken } from '@/lib/auth/one-time-token';
import { hashPassword } from '@/lib/auth/password';
import { closeDb, db } from '@/lib/db/knex';
import { launchBrowser, newPage, screenshot, signInThroughForm, watchFailures } from './helpers/browser';

let browser: Browser;
const email = `switcher-${Date.now()}@larkspur.example`;
const password = 'a long enough passphrase';
const orgs: Record<string, { id: number; name: string }> = {};

beforeAll(async () => {
  browser = await launchBrowser();
  for (const slug of ['larkspur-hollow', 'cinder-flats']) orgs[slug] = await db()('organizations').where({ slug }).first('id', 'name');
  const [userId] = await db()('users').insert({ email, name: 'Switcher', password_hash: await hashPassword(password), password_changed_at: new Date(Date.now() - 60_000) });
  await db()('memberships').insert([
    { org_id: orgs['larkspur-hollow'].id, user_id: userId, role: 'viewer' },
    { org_id: orgs['cinder-flats'].id, user_id: userId, role: 'deployer' },
  ]);
}, 60_000);
afterAll(async () => { await browser?.close(); await closeDb(); });

const nodeNamesOf = async (orgId: number) =>
  (await db()('nodes').where({ org_id: orgId }).whereNull('deleted_at').pluck('name')).sort();

describe('organization switcher in Chromium', () => {
  it('a member of two organizations changes the one shown from the header, and the fleet and role follow', async () => {
    const { page, consoleErrors } = await newPage(browser);
    const failures = watchFailures(page);
    await signInThroughForm(page, email, password);
    const fleetNames = () => page.getByTestId('fleet-row').evaluateAll((rows) => rows.map((r) => r.querySelector('a')?.textContent ?? ''));
    // Other test files may add nodes meanwhile, so: every row is one of this organization's
    // nodes, and none is one of the other's.
    const expectFleetOf = async (slug: string, other: string) => {
      const shown = await fleetNames();
      expect(shown.length).toBeGreaterThan(0);
      const mine = new Set(await nodeNamesOf(orgs[slug].id));
      const theirs = new Set(await nodeNamesOf(orgs[other].id));
      for (const name of shown) {
        expect(mine.has(name), name).toBe(true);
        expect(theirs.has(name), name).toBe(false);
      }
    };

    const select = page.getByTestId('org-switch');
    await expect(select.inputValue()).resolves.toBe(String(orgs['larkspur-hollow'].id));
    await expect(select.locator('option').allTextContents()).resolves.toEqual([`${orgs['larkspur-hollow'].name} (viewer)`, `${orgs['cinder-flats'].name} (deployer)`]);
    await page.getByTestId('fleet-row').first().waitFor();
    await expectFleetOf('larkspur-hollow', 'cinder-flats');
    expect(await page.getByTestId('member-role').textContent()).toBe('viewer');
    await screenshot(page, 'org-switch-larkspur');

    await select.selectOption(String(orgs['cinder-flats'].id));
    await page.waitForURL('**/fleet');
    await expect.poll(() => page.getByTestId('org-switch').inputValue()).toBe(String(orgs['cinder-flats'].id));
    expect(await page.getByTestId('member-role').textContent()).toBe('deployer');
    await page.getByTestId('fleet-row').first().waitFor();
    await expectFleetOf('cinder-flats', 'larkspur-hollow');
    // Its nodes report every 10 min into the chart's 5-minute buckets: every other bucket is
    // empty, and the lines must still be drawn (the first node's colour, #f4ac5c, on the canvas).
    await page.getByTestId('fleet-chart').locator('canvas').waitFor();
    await expect.poll(() => page.getByTestId('fleet-chart').locator('canvas').evaluate((canvas: HTMLCanvasElement) => {
      const d = canvas.getContext('2d')!.getImageData(0, 0, canvas.width, canvas.height).data;
      let n = 0;
      for (let i = 0; i < d.length; i += 4) if (Math.abs(d[i] - 0xf4) < 16 && Math.abs(d[i + 1] - 0xac) < 16 && Math.abs(d[i + 2] - 0x5c) < 16) n++;
      return n;
    })).toBeGreaterThan(300);
    await screenshot(page, 'org-switch-cinder');

    // The choice stays for the next page load.
    await page.goto('/sites');
    await expect(page.getByTestId('org-switch').inputValue()).resolves.toBe(String(orgs['cinder-flats'].id));
    expect(failures).toEqual([]);
    expect(consoleErrors).toEqual([]);
  });

  it('an invitation for the existing account joins with one click and keeps the password; a used link says so', async () => {
    const [orgId] = await db()('organizations').insert({ name: 'Saltgrass Test Bench', slug: `saltgrass-${Date.now()}` });
    const { token, sha256 } = newOneTimeToken();
    await db()('invitations').insert({ org_id: orgId, email, role: 'viewer', token_sha256: sha256, expires_at: new Date(Date.now() + 86_400_000) });

    const { page, consoleErrors } = await newPage(browser);
    await page.goto(`/invitations/${token}`);
    await expect(page.locator('h1').textContent()).resolves.toBe('Join Saltgrass Test Bench on Duskwatch');
    await expect(page.getByText('You already have a Duskwatch account').count()).resolves.toBe(1);
    expect(await page.getByLabel('New password').count()).toBe(0);
    await screenshot(page, 'invitation-existing-account');
    await page.getByTestId('join-existing').click();
    await page.getByTestId('joined').waitFor();

    await signInThroughForm(page, email, password);
    await expect(page.getByTestId('org-switch').locator('option').allTextContents()).resolves.toContain('Saltgrass Test Bench (viewer)');

    await page.goto(`/invitations/${token}`);
    await page.getByTestId('invitation-gone').waitFor();
    expect(consoleErrors).toEqual([]);
  });
});
