import { randomBytes } from 'node:crypto';
import { SignJWT, jwtVerify, errors as joseErrors } from 'jose';

/**
 * Device tokens: JWTs signed by the server with HS256 only (jwtVerify is pinned to that one
 * algorithm, so `alg: none` and every other algorithm are refused). The token names the node
 * (`sub`) and a random 128-bit credential id (`jti`); the database keeps the id, never the token.
 */
const ALGORITHM = 'HS256';
const ISSUER = 'duskwatch';
const AUDIENCE = 'duskwatch:ingest';

export function newCredentialId(): string {
  return randomBytes(16).toString('hex');
}

function keyFrom(secret: string): Uint8Array {
  return new TextEncoder().encode(secret);
}

export async function signDeviceToken(opts: { secret: string; nodeId: number; credentialId: string }): Promise<string> {
  return new SignJWT({})
    .setProtectedHeader({ alg: ALGORITHM, typ: 'JWT' })
    .setSubject(String(opts.nodeId))
    .setJti(opts.credentialId)
    .setIssuer(ISSUER)
    .setAudience(AUDIENCE)
    .setIssuedAt()
    .sign(keyFrom(opts.secret));
}

export interface DeviceClaims {
  nodeId: number;
  credentialId: string;
}

/**
 * Tokens already verified, so a device posting every few minutes costs one HMAC check per
 * process, not one per post (the signature check was a sixth of the ingest route's CPU). Only
 * tokens that passed jwtVerify get in; an entry keeps the token's own expiry, and revocation is
 * unaffected (the credential is checked in the database on every post). Bounded: the oldest
 * entry goes when full.
 */
const verified = new Map<string, { secret: string; claims: DeviceClaims; expMs: number | null }>();
const CACHE_MAX = 20_000;

/** Returns the claims, or null for anything that is not a token we signed. */
export async function verifyDeviceToken(opts: { secret: string; token: string }): Promise<DeviceClaims | null> {
  const hit = verified.get(opts.token);
  if (hit && hit.secret === opts.secret) {
    if (hit.expMs === null || Date.now() < hit.expMs) return hit.claims;
    verified.delete(opts.token);
    return null;
  }
  try {
    const { payload } = await jwtVerify(opts.token, keyFrom(opts.secret), {
      algorithms: [ALGORITHM],
      issuer: ISSUER,
      audience: AUDIENCE,
    });
    const nodeId = Number(payload.sub);
    if (!Number.isSafeInteger(nodeId) || nodeId <= 0) return null;
    if (typeof payload.jti !== 'string' || !/^[0-9a-f]{32}$/.test(payload.jti)) return null;
    const claims = { nodeId, credentialId: payload.jti };
    if (verified.size >= CACHE_MAX) verified.delete(verified.keys().next().value as string);
    verified.set(opts.token, { secret: opts.secret, claims, expMs: typeof payload.exp === 'number' ? payload.exp * 1000 : null });
    return claims;
  } catch (e) {
    if (e instanceof joseErrors.JOSEError || e instanceof TypeError) return null;
    throw e;
  }
}
