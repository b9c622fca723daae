import bcrypt from 'bcryptjs';
import { describe, expect, it, vi } from 'vitest';
import { checkPassword, hashPassword, passwordSchema } from '@/lib/auth/password';

describe('passwords', () => {
  it('policy: at least 10 characters, up to at least 64, no composition rules (OWASP ASVS 5.0 V6.2.1, V6.2.9, V6.2.5)', () => {
    expect(passwordSchema.safeParse('123456789').success).toBe(false);
    expect(passwordSchema.safeParse('aaaaaaaaaa').success).toBe(true); // no composition rules
    expect(passwordSchema.safeParse('x'.repeat(64)).success).toBe(true);
  });

  it('hashes with bcrypt at cost ≥ 10', async () => {
    const hash = await hashPassword('correct horse battery');
    expect(bcrypt.getRounds(hash)).toBeGreaterThanOrEqual(10);
    expect(await checkPassword('correct horse battery', hash)).toBe(true);
    expect(await checkPassword('wrong horse battery', hash)).toBe(false);
  });

  it('pays one bcrypt comparison for an unknown account too, so both answers take similar time', async () => {
    const spy = vi.spyOn(bcrypt, 'compare');
    expect(await checkPassword('anything at all', null)).toBe(false);
    expect(spy).toHaveBeenCalledTimes(1);
    const [, againstHash] = spy.mock.calls[0] as unknown as [string, string];
    expect(bcrypt.getRounds(againstHash)).toBeGreaterThanOrEqual(10);
    spy.mockRestore();
  });
});
