import supertest from 'supertest';

/**
 * API and browser tests run against the real app and MariaDB that `npm test` starts
 * (db/lifecycle/test.ts). Run alone, they say so instead of failing obscurely.
 */
export function appUrl(): string {
  if (!process.env.DUSKWATCH_TEST_STACK || !process.env.APP_URL) {
    throw new Error('API tests need the test stack: run them through `npm test` (optionally `npm test -- --project api`)');
  }
  return process.env.APP_URL;
}

export function api() {
  return supertest(appUrl());
}
