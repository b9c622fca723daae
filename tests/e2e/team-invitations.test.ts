import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, db } from '@/lib/db/knex';
import { launchBrowser, newPage, screenshot, signInThroughForm } from './helpers/browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  // This file's invitation mail sits in the demo organization's outbox: take it out again.
  await db()('email_outbox').where('to_address', 'like', 'cancel-e2e-%@larkspur.example').delete();
  await db()('invitations').where('email', 'like', 'cancel-e2e-%@larkspur.example').delete();
  await closeDb();
});

describe('open invitations on the team page, in Chromium', () => {
  it('an owner invites, the form empties, and Cancel with its confirmation takes the invitation off the list', async () => {
    const { page, consoleErrors } = await newPage(browser);
    await signInThroughForm(page, 'owner@larkspur.example');
    await page.goto('/team');
    const email = `cancel-e2e-${Date.now()}@larkspur.example`;
    await page.getByLabel(/e-mail/i).first().fill(email);
    await page.getByRole('button', { name: /invite|send/i }).click();
    await page.getByTestId('invite-link').waitFor();
    expect(await page.getByLabel(/e-mail/i).first().inputValue()).toBe('');
    const row = page.getByTestId('invitation-row').filter({ hasText: email });
    await row.waitFor();
    await row.getByTestId('invitation-cancel').click();
    await row.getByTestId('invitation-cancel-confirm').click();
    await row.waitFor({ state: 'detached' });
    expect(await db()('invitations').where({ email }).count({ n: '*' })).toEqual([{ n: 0 }]);
    await screenshot(page, 'team-invitation-cancelled');
    expect(consoleErrors).toEqual([]);
  });
});
