import { createHash, randomBytes } from 'node:crypto';

/** Single-use links (invitations, password resets): 256 random bits; only the hash is stored. */
export function newOneTimeToken(): { token: string; sha256: Buffer } {
  const token = randomBytes(32).toString('base64url');
  return { token, sha256: hashOneTimeToken(token) };
}

export function hashOneTimeToken(token: string): Buffer {
  return createHash('sha256').update(token, 'utf8').digest();
}
