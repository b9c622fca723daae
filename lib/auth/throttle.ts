import { db } from '../db/knex';

/**
 * Sign-in throttling (OWASP ASVS 5.0 V6.3.1): failures per account and per client address
 * within a 15-minute window. Past a free allowance each further failure doubles a short
 * wait, capped at 15 minutes, so a storm slows down but a real user is never locked out for good.
 */
const WINDOW_SECONDS = 15 * 60;
const MAX_WAIT_SECONDS = 15 * 60;
const FREE_FAILURES = { email: 5, ip: 30 } as const;

type KeyKind = keyof typeof FREE_FAILURES;

export function throttleKeys(email: string, ip: string): { kind: KeyKind; key: string }[] {
  return [
    { kind: 'email', key: `email:${email.trim().toLowerCase()}` },
    { kind: 'ip', key: `ip:${ip}` },
  ];
}

export async function isThrottled(keys: { key: string }[]): Promise<boolean> {
  const row = await db()('signin_throttle')
    .whereIn('throttle_key', keys.map((k) => k.key))
    .andWhere('blocked_until', '>', db().raw('CURRENT_TIMESTAMP(3)'))
    .first('throttle_key');
  return Boolean(row);
}

export async function recordFailure(keys: { kind: KeyKind; key: string }[]): Promise<void> {
  for (const { kind, key } of keys) {
    const free = FREE_FAILURES[kind];
    await db().raw(
      `INSERT INTO signin_throttle (throttle_key, failures, window_started_at, blocked_until)
       VALUES (?, 1, CURRENT_TIMESTAMP(3), NULL)
       ON DUPLICATE KEY UPDATE
         failures = IF(window_started_at < CURRENT_TIMESTAMP(3) - INTERVAL ${WINDOW_SECONDS} SECOND, 1, failures + 1),
         window_started_at = IF(window_started_at < CURRENT_TIMESTAMP(3) - INTERVAL ${WINDOW_SECONDS} SECOND, CURRENT_TIMESTAMP(3), window_started_at),
         blocked_until = IF(failures > ?, CURRENT_TIMESTAMP(3) + INTERVAL LEAST(POW(2, failures - ?), ?) SECOND, NULL)`,
      [key, free, free, MAX_WAIT_SECONDS],
    );
  }
}

export async function clearFailures(key: string): Promise<void> {
  await db()('signin_throttle').where({ throttle_key: key }).delete();
}
