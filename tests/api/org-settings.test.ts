import { afterAll, describe, expect, it } from 'vitest';
import { api } from './helpers/stack';
import { signedIn } from './helpers/session';

// GET/PUT /api/v1/org/settings: any member reads, only an owner writes (DESIGN.md §2, §4).
const defaults = { steady_margin: 1.5, thin_margin: 1.0, alert_on_thin: false, resend_short_hours: 6, mail_cap_per_hour: 60 };

async function put(email: string, body: unknown) {
  const s = await signedIn(email);
  return s.agent.put('/api/v1/org/settings').set('origin', s.origin).send(body as object);
}

afterAll(async () => {
  // Leave the demo's thresholds as DESIGN.md §4 gives them for the suites that follow.
  await put('owner@larkspur.example', defaults);
});

describe('organization settings', () => {
  it('lets any member read the thresholds (DESIGN.md §4 defaults: steady ≥ 1.5, thin ≥ 1.0)', async () => {
    const s = await signedIn('viewer@larkspur.example');
    const res = await s.agent.get('/api/v1/org/settings');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ name: 'Larkspur Hollow Watershed Trust', ...defaults });
    expect((await api().get('/api/v1/org/settings')).status).toBe(401);
  });

  it('refuses viewers and deployers (403), and a write without our Origin', async () => {
    expect((await put('viewer@larkspur.example', defaults)).status).toBe(403);
    expect((await put('deployer@larkspur.example', defaults)).status).toBe(403);
    const s = await signedIn('owner@larkspur.example');
    expect((await s.agent.put('/api/v1/org/settings').send(defaults)).status).toBe(403);
  });

  it('answers 422 with a pointer to each bad field: thin at or above steady, a fractional hour, a zero cap', async () => {
    const equal = await put('owner@larkspur.example', { ...defaults, steady_margin: 1.2, thin_margin: 1.2 });
    expect(equal.status).toBe(422);
    expect(equal.headers['content-type']).toContain('application/problem+json');
    const pointers = equal.body.errors.map((e: { pointer: string }) => e.pointer).sort();
    expect(pointers).toEqual(['/steady_margin', '/thin_margin']);
    const above = await put('owner@larkspur.example', { ...defaults, steady_margin: 1.1, thin_margin: 1.4 });
    expect(above.status).toBe(422);
    const many = await put('owner@larkspur.example', { ...defaults, thin_margin: 0, resend_short_hours: 1.5, mail_cap_per_hour: 0 });
    expect(many.status).toBe(422);
    expect(many.body.errors.map((e: { pointer: string }) => e.pointer).sort()).toEqual(['/mail_cap_per_hour', '/resend_short_hours', '/thin_margin']);
    // Nothing was changed by the refused writes.
    const s = await signedIn('viewer@larkspur.example');
    expect((await s.agent.get('/api/v1/org/settings')).body).toMatchObject(defaults);
  });

  it('stores an owner\'s change, which the next read returns', async () => {
    const changed = { steady_margin: 2, thin_margin: 1.25, alert_on_thin: true, resend_short_hours: 12, mail_cap_per_hour: 30 };
    const res = await put('owner@larkspur.example', changed);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject(changed);
    const s = await signedIn('deployer@larkspur.example');
    expect((await s.agent.get('/api/v1/org/settings')).body).toMatchObject(changed);
    // Another organization's settings stay as they were.
    const other = await signedIn('owner@cinderflats.example');
    expect((await other.agent.get('/api/v1/org/settings')).body).toMatchObject(defaults);
  });
});
