import type { Knex } from 'knex';

/**
 * A MariaDB named lock held on one dedicated connection for the length of `fn`. GET_LOCK with
 * timeout 0 answers at once: 1 granted, 0 held by another session. The lock belongs to the
 * connection, so it is released explicitly and, if the process dies, by the server when the
 * connection drops. `fn` runs its own queries on the pool, not on the lock's connection.
 */
export type LockOutcome<T> = { ran: true; value: T } | { ran: false };

export async function withNamedLock<T>({ knex, name }: { knex: Knex; name: string }, fn: () => Promise<T>): Promise<LockOutcome<T>> {
  const connection = await knex.client.acquireConnection();
  try {
    const [rows] = await knex.raw('SELECT GET_LOCK(?, 0) AS got', [name]).connection(connection);
    if (Number(rows[0]?.got) !== 1) return { ran: false };
    try {
      return { ran: true, value: await fn() };
    } finally {
      await knex.raw('SELECT RELEASE_LOCK(?) AS released', [name]).connection(connection).catch(() => undefined);
    }
  } finally {
    await knex.client.releaseConnection(connection);
  }
}

export const MARGIN_PASS_LOCK = 'duskwatch:margin-pass';
export const MAIL_PASS_LOCK = 'duskwatch:mail-pass';
