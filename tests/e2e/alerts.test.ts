import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, db } from '@/lib/db/knex';
import { runMarginPass } from '@/lib/jobs/margin-pass';
import { launchBrowser, newPage, screenshot, SCREENSHOT_DIR, signInThroughForm } from './helpers/browser';

// The alerts and alert e-mail screens in Debian's Chromium against the demo (issue 7 "Alerts:
// lists and acknowledge", issue 6 subscriptions). The demo data has open alerts only once a
// margin pass has run, so one runs first, as the job runner would (issue 6: within two passes
// of start-up at least one seeded node is short with an open alert).
let browser: Browser;
let larkspurId: number;

beforeAll(async () => {
  browser = await launchBrowser();
  const report = await runMarginPass({ knex: db(), appUrl: process.env.APP_URL!, now: new Date() });
  expect(report.ran).toBe(true);
  larkspurId = (await db()('organizations').where({ slug: 'larkspur-hollow' }).first('id')).id;
});
afterAll(async () => {
  await browser?.close();
  await closeDb();
});

const openIds = async () => (await db()('alerts').where({ org_id: larkspurId, status: 'open' }).orderBy('opened_at', 'desc').pluck('id')).map(Number);
const cardIds = (page: Page) => page.getByTestId('alert-card').evaluateAll((cards) => cards.map((c) => Number(c.getAttribute('data-alert-id'))));

async function openAlerts(page: Page, email: string) {
  await signInThroughForm(page, email);
  await page.goto('/alerts');
  await page.getByRole('tab', { name: 'open' }).waitFor();
}

/** Nothing wider than the viewport: 390 px cards, no sideways scrolling (issue 7: usable at 390 px). */
async function expectNoSidewaysScroll(page: Page, width: number) {
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(width);
}

describe('the alerts page', () => {
  it('shows a deployer the open alerts; acknowledging one moves it to acknowledged', async () => {
    const expected = await openIds();
    expect(expected.length).toBeGreaterThan(0);
    const { page, consoleErrors } = await newPage(browser);
    await openAlerts(page, 'deployer@larkspur.example');
    expect((await cardIds(page)).sort()).toEqual([...expected].sort());
    const first = page.getByTestId('alert-card').first();
    // Node link, kind in words, the node's state by glyph and word (DESIGN.md §9), e-mail status.
    expect(await first.getByTestId('alert-node').getAttribute('href')).toMatch(/^\/nodes\/\d+$/);
    expect(await first.locator('[data-state] svg').count()).toBe(1);
    await expect(first.textContent()).resolves.toMatch(/Opened .*\d\d:\d\d/);
    await expect(first.getByTestId('alert-mail').textContent()).resolves.toMatch(/E-mail:/);
    expect(await page.getByTestId('acknowledge').count()).toBe(expected.length);
    await screenshot(page, 'alerts-deployer-desktop');

    const id = Number(await first.getAttribute('data-alert-id'));
    await first.getByTestId('acknowledge').click();
    await page.getByTestId('alerts-message').filter({ hasText: 'Acknowledged' }).waitFor();
    await page.locator(`[data-testid="alert-card"][data-alert-id="${id}"]`).waitFor({ state: 'detached' });
    expect((await db()('alerts').where({ id }).first('status')).status).toBe('acknowledged');

    await page.getByRole('tab', { name: 'acknowledged' }).click();
    const moved = page.locator(`[data-testid="alert-card"][data-alert-id="${id}"]`);
    await moved.waitFor();
    expect(await moved.getAttribute('data-status')).toBe('acknowledged');
    await expect(moved.textContent()).resolves.toContain('Acknowledged by Bo Demo-Deployer');
    expect(await moved.getByTestId('acknowledge').count()).toBe(0);
    expect(page.url()).toContain('status=acknowledged');
    await screenshot(page, 'alerts-acknowledged-desktop');
    expect(consoleErrors).toEqual([]);
  });

  it('shows a viewer the alerts without an acknowledge button, as cards at 390 px', async () => {
    const { page, consoleErrors } = await newPage(browser, { width: 390, height: 844 });
    await openAlerts(page, 'viewer@larkspur.example');
    await page.getByTestId('alert-card').first().waitFor();
    expect(await page.getByTestId('acknowledge').count()).toBe(0);
    expect(await page.getByTestId('outbox-panel').count()).toBe(0);
    await expectNoSidewaysScroll(page, 390);
    await screenshot(page, 'alerts-viewer-390');
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'alerts-viewer-390-first-screen.png') });
    expect(consoleErrors).toEqual([]);
  });

  it('filters by kind and by node, keeps the filters in the address, and moves between tabs by keyboard', async () => {
    const { page, consoleErrors } = await newPage(browser);
    await openAlerts(page, 'viewer@larkspur.example');
    const some = await db()('alerts').where({ org_id: larkspurId, status: 'open' }).first('kind', 'node_id');
    await page.getByLabel('Kind', { exact: true }).selectOption(some.kind);
    await page.waitForFunction((kind) => new URLSearchParams(location.search).get('kind') === kind, some.kind);
    await page.getByTestId('alert-card').first().waitFor();
    const kinds = await page.getByTestId('alert-card').evaluateAll((cards) => cards.map((c) => c.getAttribute('data-kind')));
    expect(new Set(kinds)).toEqual(new Set([some.kind]));
    // A kind with no alert in the demo's open list gives the filtered empty state.
    await page.getByLabel('Node state now', { exact: true }).selectOption('new');
    await page.getByTestId('alerts-empty').waitFor();
    await screenshot(page, 'alerts-filtered-empty');
    await page.getByRole('button', { name: 'Clear the filters' }).click();
    await page.getByTestId('alert-card').first().waitFor();

    await page.goto(`/alerts?status=acknowledged&node=${some.node_id}`);
    await page.getByText('Only node').waitFor();
    // Keyboard: from the selected tab, arrow keys move the selection (WAI-ARIA tabs pattern).
    await page.getByRole('tab', { name: 'acknowledged' }).focus();
    await page.keyboard.press('ArrowRight');
    expect(await page.getByRole('tab', { name: 'resolved' }).getAttribute('aria-selected')).toBe('true');
    await page.keyboard.press('ArrowRight');
    expect(await page.getByRole('tab', { name: 'open' }).getAttribute('aria-selected')).toBe('true');
    await page.waitForFunction((node) => location.search === `?status=open&node=${node}`, some.node_id);
    await page.waitForFunction(() => document.querySelectorAll('[data-testid="alert-card"], [data-testid="alerts-empty"]').length > 0);
    const nodes = await page.getByTestId('alert-node').evaluateAll((links) => links.map((a) => a.getAttribute('href')));
    expect(nodes.every((href) => href === `/nodes/${some.node_id}`)).toBe(true);
    expect(consoleErrors).toEqual([]);
  });

  it('shows owners the outbox with dead letters and their error, and held mail with when it goes', async () => {
    // (Earlier suites may already have delivered it: any of its rows will do.)
    // The pass's e-mail of an unresolved alert dead-lettered as the sender does after a 550, and a
    // reminder of it held by the hourly cap (lib/mail/sender.ts writes both the same way).
    const row = await db()('email_outbox as e').join('alerts as a', 'a.id', 'e.alert_id')
      .where({ 'e.org_id': larkspurId }).whereIn('e.status', ['pending', 'sent']).whereNot('a.status', 'resolved').orderBy('e.id').first('e.*', 'a.status as alert_status');
    expect(row).toBeDefined();
    const until = new Date(Date.now() + 40 * 60_000);
    await db()('email_outbox').where({ id: row.id }).update({ status: 'dead', attempts: 1, last_error: '550 5.1.1 mailbox unavailable' });
    await db()('email_outbox').insert({
      org_id: larkspurId, alert_id: row.alert_id, purpose: 'alert', to_address: row.to_address, subject: `Reminder: ${row.subject}`,
      text_body: row.text_body, html_body: row.html_body, message_id: `<e2e-held-${row.id}@duskwatch.local>`, next_attempt_at: until,
      last_error: `held: the organization's cap of 60 e-mails an hour is reached; goes out from ${until.toISOString()}`,
    });

    for (const width of [1280, 390]) {
      const { page, consoleErrors } = await newPage(browser, { width, height: 900 });
      await openAlerts(page, 'owner@larkspur.example');
      if (row.alert_status !== 'open') await page.getByRole('tab', { name: row.alert_status }).click();
      const panel = page.getByTestId('outbox-panel');
      await panel.getByTestId('outbox-counts').waitFor();
      await expect(panel.locator('[data-bucket="dead"]').first().textContent()).resolves.toContain('550 5.1.1 mailbox unavailable');
      await expect(panel.locator('[data-bucket="held"]').first().textContent()).resolves.toMatch(/goes out from .*\d\d:\d\d/);
      // The alert whose mail died says so on its card, with the error for the owner, and its held reminder.
      const mail = await page.locator(`[data-testid="alert-card"][data-alert-id="${row.alert_id}"]`).getByTestId('alert-mail').textContent();
      expect(mail).toMatch(/1 held until .*\d\d:\d\d .*1 dead/);
      expect(mail).toContain('550 5.1.1 mailbox unavailable');
      if (width === 390) await expectNoSidewaysScroll(page, 390);
      await screenshot(page, `alerts-owner-${width === 390 ? '390' : 'desktop'}`);
      expect(consoleErrors).toEqual([]);
    }
    // A viewer sees that the mail died, not the relay's error (issue brief: the error is for owners).
    const { page, consoleErrors } = await newPage(browser);
    await openAlerts(page, 'viewer@larkspur.example');
    if (row.alert_status !== 'open') await page.getByRole('tab', { name: row.alert_status }).click();
    const viewerMail = await page.locator(`[data-testid="alert-card"][data-alert-id="${row.alert_id}"]`).getByTestId('alert-mail').textContent();
    expect(viewerMail).toContain('1 dead');
    expect(viewerMail).not.toContain('550');
    expect(consoleErrors).toEqual([]);
  });
});

describe('the alert e-mail page', () => {
  it('shows an owner the default, and a deployer\u2019s choice saves and survives a reload', async () => {
    const owner = await newPage(browser);
    await signInThroughForm(owner.page, 'owner@larkspur.example');
    await owner.page.goto('/account/subscriptions');
    await owner.page.getByTestId('subscriptions-default').waitFor();
    // The owner default (issue 6, with what needs someone to act): short, dark, dark through a
    // day, silent and over-voltage alerts, immediately, from every site.
    const all = owner.page.getByTestId('subscription-all');
    expect(await all.locator('input[data-kind="reserve_short"]').isChecked()).toBe(true);
    for (const kind of ['over_voltage', 'node_dark', 'dark_through_day', 'node_silent']) expect(await all.locator(`input[data-kind="${kind}"]`).isChecked(), kind).toBe(true);
    expect(await all.locator('input[type="checkbox"]:checked').count()).toBe(5);
    expect(await all.getByLabel(/Right away/).isChecked()).toBe(true);
    await screenshot(owner.page, 'subscriptions-owner-desktop');
    expect(owner.consoleErrors).toEqual([]);

    const { page, consoleErrors } = await newPage(browser, { width: 390, height: 844 });
    await signInThroughForm(page, 'deployer@larkspur.example');
    await page.goto('/account/subscriptions');
    const every = page.getByTestId('subscription-all');
    await every.waitFor();
    expect(await page.getByTestId('subscriptions-default').count()).toBe(0);
    await every.locator('input[data-kind="node_dark"]').check();
    await every.locator('input[data-kind="draw_anomaly"]').check();
    await every.getByLabel(/Daily digest/).check();
    await page.getByLabel('A site with its own choice').selectOption({ label: 'Quarry Road culvert' });
    await page.getByRole('button', { name: 'Add site' }).click();
    const quarryId = Number((await db()('sites').where({ org_id: larkspurId, name: 'Quarry Road culvert' }).first('id')).id);
    const quarry = page.getByTestId(`subscription-${quarryId}`);
    await quarry.locator('input[data-kind="draw_anomaly"]').uncheck();
    await quarry.locator('input[data-kind="reserve_short"]').check();
    await quarry.getByLabel(/Right away/).check();
    await expectNoSidewaysScroll(page, 390);
    await screenshot(page, 'subscriptions-deployer-390');
    await page.getByTestId('subscriptions-save').click();
    await page.getByTestId('subscriptions-message').filter({ hasText: 'Saved' }).waitFor();

    await page.reload();
    await every.waitFor();
    const checked = async (row: typeof every) => row.locator('input[type="checkbox"]:checked').evaluateAll((els) => els.map((e) => e.getAttribute('data-kind')));
    expect(await checked(every)).toEqual(['node_dark', 'draw_anomaly']);
    expect(await every.getByLabel(/Daily digest/).isChecked()).toBe(true);
    expect(await checked(quarry)).toEqual(['reserve_short', 'node_dark']);
    expect(await quarry.getByLabel(/Right away/).isChecked()).toBe(true);
    // What the server holds is what the page shows.
    const membership = await db()('memberships as m').join('users as u', 'u.id', 'm.user_id').where({ 'u.email': 'deployer@larkspur.example' }).first('m.id');
    const rows = await db()('alert_subscriptions').where({ membership_id: membership.id }).orderBy('site_id');
    expect(rows.map((r) => ({ site: r.site_id, delivery: r.delivery }))).toEqual([{ site: null, delivery: 'digest' }, { site: quarryId, delivery: 'immediate' }]);
    await screenshot(page, 'subscriptions-deployer-saved-390');
    expect(consoleErrors).toEqual([]);
  });
});
