import { describe, expect, it } from 'vitest';
import { profileEnv, resolveProfile } from '@/db/lifecycle/profile';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';

describe('profiles', () => {
  it('keep demo and test apart: data dir, port, database', () => {
    const demo = resolveProfile('demo', '/repo');
    const test = resolveProfile('test', '/repo');
    expect(demo.mysqlDir).not.toBe(test.mysqlDir);
    expect(demo.dbPort).not.toBe(test.dbPort);
    expect(demo.dbName).not.toBe(test.dbName);
    expect(demo.appPort).not.toBe(test.appPort);
  });

  it('generate secrets once and keep them', () => {
    const root = mkdtempSync(path.join(tmpdir(), 'dw-'));
    const first = profileEnv(resolveProfile('demo', root));
    const second = profileEnv(resolveProfile('demo', root));
    expect(first.NEXTAUTH_SECRET.length).toBeGreaterThanOrEqual(32);
    expect(second.NEXTAUTH_SECRET).toBe(first.NEXTAUTH_SECRET);
    expect(second.DB_PASSWORD).toBe(first.DB_PASSWORD);
  });
});
