import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

// TypeScript strict over the whole tree (app, lib, db, simulator, tests): part of npm test.
describe('the TypeScript tree', () => {
  it('type-checks with tsc --noEmit', () => {
    const r = spawnSync(path.resolve('node_modules/.bin/tsc'), ['--noEmit', '-p', '.'], { encoding: 'utf8' });
    expect(r.stdout + r.stderr).toBe('');
    expect(r.status).toBe(0);
  }, 180_000);
});
