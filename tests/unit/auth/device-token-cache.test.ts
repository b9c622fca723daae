import { SignJWT } from 'jose';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { newCredentialId, signDeviceToken, verifyDeviceToken } from '@/lib/auth/device-token';

// The verified-token cache must not change a single answer of the signature check (RFC 7519
// §4.1.4: a token is not accepted on or after its "exp").
const secret = 'a-test-secret-of-thirty-two-chars!!';
const key = new TextEncoder().encode(secret);

afterEach(() => vi.useRealTimers());

describe('verifyDeviceToken with its cache', () => {
  it('answers the same claims the second time', async () => {
    const credentialId = newCredentialId();
    const token = await signDeviceToken({ secret, nodeId: 42, credentialId });
    expect(await verifyDeviceToken({ secret, token })).toEqual({ nodeId: 42, credentialId });
    expect(await verifyDeviceToken({ secret, token })).toEqual({ nodeId: 42, credentialId });
  });

  it('refuses a cached token once its exp has passed', async () => {
    vi.useFakeTimers({ toFake: ['Date'] });
    vi.setSystemTime(new Date('2026-12-01T20:00:00Z'));
    const token = await new SignJWT({}).setProtectedHeader({ alg: 'HS256' }).setSubject('7').setJti(newCredentialId())
      .setIssuer('duskwatch').setAudience('duskwatch:ingest').setIssuedAt().setExpirationTime('60s').sign(key);
    expect(await verifyDeviceToken({ secret, token })).not.toBeNull();
    vi.setSystemTime(new Date('2026-12-01T20:00:59Z'));
    expect(await verifyDeviceToken({ secret, token })).not.toBeNull();
    vi.setSystemTime(new Date('2026-12-01T20:01:00Z'));
    expect(await verifyDeviceToken({ secret, token })).toBeNull();
    expect(await verifyDeviceToken({ secret, token })).toBeNull();
  });

  it('does not let a cached token through under another secret', async () => {
    const token = await signDeviceToken({ secret, nodeId: 9, credentialId: newCredentialId() });
    expect(await verifyDeviceToken({ secret, token })).not.toBeNull();
    expect(await verifyDeviceToken({ secret: 'another-secret-of-thirty-two-chars!', token })).toBeNull();
  });

  it('never caches a refusal into an acceptance: a forged token stays refused', async () => {
    const good = await signDeviceToken({ secret, nodeId: 5, credentialId: newCredentialId() });
    const [h, p] = good.split('.');
    const forged = `${h}.${p}.${'A'.repeat(43)}`;
    expect(await verifyDeviceToken({ secret, token: forged })).toBeNull();
    expect(await verifyDeviceToken({ secret, token: forged })).toBeNull();
  });
});
