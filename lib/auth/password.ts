import bcrypt from 'bcryptjs';
import { z } from 'zod';

/** Password policy (OWASP ASVS 5.0 V6.2): 10 to 128 characters, no composition rules. */
export const passwordSchema = z
  .string()
  .min(10, 'Use at least 10 characters.')
  .max(128, 'Use at most 128 characters.');

const COST = 11;

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, COST);
}

// Compared against when the e-mail is unknown, so both answers take the same time.
const DUMMY_HASH = bcrypt.hashSync('duskwatch-no-such-user-padding', COST);

export async function checkPassword(password: string, hash: string | null | undefined): Promise<boolean> {
  const ok = await bcrypt.compare(password, hash ?? DUMMY_HASH);
  return ok && Boolean(hash);
}
