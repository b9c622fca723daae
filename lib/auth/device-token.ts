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

/** Returns the claims, or null for anything that is not a token we signed. */
export async function verifyDeviceToken(opts: { secret: string; token: string }): Promise<DeviceClaims | null> {
  try {
    const { payload } = await jwtVerify(opts.token, keyFrom(opts.secret), {
      algorithms: [ALGORITHM],
      issuer: ISSUER,
      audience: AUDIENCE,
    });
    const nodeId = Number(payload.sub);
    if (!Number.isSafeInteger(nodeId) || nodeId <= 0) return null;
    if (typeof payload.jti !== 'string' || !/^[0-9a-f]{32}$/.test(payload.jti)) return null;
    return { nodeId, credentialId: payload.jti };
  } catch (e) {
    if (e instanceof joseErrors.JOSEError || e instanceof TypeError) return null;
    throw e;
  }
}
