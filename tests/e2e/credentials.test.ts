import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb } from '@/lib/db/knex';
import { appUrl } from '../api/helpers/stack';
import { createTestNode } from '../api/helpers/fleet';
import { launchBrowser, newPage, screenshot, signInThroughForm, watchFailures } from './helpers/browser';

let browser: Browser;
beforeAll(async () => { browser = await launchBrowser(); });
afterAll(async () => { await browser?.close(); await closeDb(); });


const postReading = (token: string) =>
  fetch(`${appUrl()}/api/v1/readings`, { method: 'POST', headers: { authorization: `Bearer ${token}`, 'content-type': 'application/json' }, body: JSON.stringify({ v: 4.5 }) });

describe('device credentials in Chromium', () => {
  it('shows a new token once, works until revoked, and is gone after a reload', async () => {
    const { nodeId } = await createTestNode('e2e-cred');
    const { page, consoleErrors } = await newPage(browser);
    const failures = watchFailures(page, [/^422 /]);
    await signInThroughForm(page, 'deployer@larkspur.example');
    await page.goto(`/nodes/${nodeId}/credentials`);
    const rowsBefore = await page.getByTestId('credential-row').count();

    // A blank label is refused by the field, and nothing is sent.
    const posts: string[] = [];
    page.on('request', (r) => { if (r.method() === 'POST' && r.url().includes('/credentials')) posts.push(r.url()); });
    await page.getByLabel('Label').fill('   ');
    await page.getByTestId('credential-create').click();
    await expect(page.locator('#credential-label-error').textContent()).resolves.toContain('Give the credential a label');
    await expect(page.getByLabel('Label').getAttribute('aria-invalid')).resolves.toBe('true');
    expect(posts).toEqual([]);
    expect(await page.getByTestId('token-once').count()).toBe(0);

    const label = `field unit ${Date.now()}`;
    await page.getByLabel('Label').fill(label);
    await page.getByTestId('credential-create').click();
    await page.getByTestId('token-once').waitFor();
    await expect(page.getByTestId('token-once').textContent()).resolves.toContain('Store it now; it cannot be shown again.');
    expect(await page.getByTestId('token-copy').isVisible()).toBe(true);
    const token = await page.getByTestId('token-value').inputValue();
    expect(token).toMatch(/^eyJ[\w-]+\.[\w-]+\.[\w-]+$/); // a compact JWS (RFC 7515 §7.1)
    await expect.poll(() => page.getByTestId('credential-row').count()).toBe(rowsBefore + 1);
    await screenshot(page, 'credentials-token-once');

    // The token is real: the device contract accepts it (DESIGN.md §5).
    expect((await postReading(token)).status).toBe(200);

    await page.reload();
    await page.getByTestId('credential-list').waitFor();
    expect(await page.getByTestId('token-once').count()).toBe(0);
    expect(await page.content()).not.toContain(token);

    const row = page.getByTestId('credential-row').filter({ hasText: label });
    await row.getByTestId('credential-revoke').click();
    await row.getByTestId('credential-revoke-confirm').click();
    await expect.poll(() => row.getAttribute('data-revoked')).toBe('yes');
    expect((await postReading(token)).status).toBe(401);
    await screenshot(page, 'credentials-revoked');

    const phone = await newPage(browser, { width: 390, height: 844 });
    await signInThroughForm(phone.page, 'deployer@larkspur.example');
    await phone.page.goto(`/nodes/${nodeId}/credentials`);
    await phone.page.getByTestId('credential-list').waitFor();
    await screenshot(phone.page, 'credentials-390');
    expect(failures).toEqual([]);
    expect(consoleErrors.filter((e) => !e.startsWith('Failed to load resource'))).toEqual([]);
  });
});
