import { defineConfig } from 'vitest/config';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const here = path.dirname(fileURLToPath(import.meta.url));

// This file lives in tests/; the repository root is one level up.
const repoRoot = path.basename(here) === 'tests' ? path.resolve(here, '..') : here;
const alias = { '@': repoRoot };

export default defineConfig({
  root: repoRoot,
  resolve: { alias },
  test: {
    projects: [
      {
        resolve: { alias },
        test: { name: 'unit', include: ['tests/unit/**/*.test.ts'], environment: 'node', sequence: { groupOrder: 0 } },
      },
      {
        resolve: { alias },
        test: {
          name: 'api',
          // Projects run one after another: API tests stop MariaDB on purpose (outage tests),
          // which must never overlap the browser tests.
          sequence: { groupOrder: 1 },
          include: ['tests/api/**/*.test.ts'],
          environment: 'node',
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 120_000,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'e2e',
          sequence: { groupOrder: 2 },
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          fileParallelism: false,
          testTimeout: 60_000,
          hookTimeout: 120_000,
        },
      },
    ],
  },
});
