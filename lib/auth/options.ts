import type { NextAuthOptions } from 'next-auth';
import CredentialsProvider from 'next-auth/providers/credentials';
import { z } from 'zod';
import { writeAudit } from '../audit';
import { findUserByEmail, normalizeEmail } from '../db/queries/people';
import { getEnv, requireSecret } from '../env';
import { checkPassword } from './password';
import { clearFailures, isThrottled, recordFailure, throttleKeys } from './throttle';

const credentialsSchema = z.object({ email: z.string().trim().min(3).max(254), password: z.string().min(1).max(1024) });

/** The client address: set from the socket by lib/server/serve.ts, never taken from the client. */
export function clientAddress(headers: Record<string, string | string[] | undefined> | Headers): string {
  const raw = headers instanceof Headers ? headers.get('x-forwarded-for') : headers['x-forwarded-for'];
  const value = Array.isArray(raw) ? raw[0] : raw;
  return (value ?? 'unknown').split(',')[0].trim();
}

let cached: NextAuthOptions | undefined;

/** Built on first use, so that a build without secrets in the environment still works. */
export function authOptions(): NextAuthOptions {
  cached ??= buildAuthOptions();
  return cached;
}

function buildAuthOptions(): NextAuthOptions {
  const secureCookies = getEnv().APP_URL.startsWith('https://');
  return {
  secret: requireSecret('NEXTAUTH_SECRET'),
  session: { strategy: 'jwt', maxAge: 12 * 60 * 60 },
  pages: { signIn: '/sign-in', error: '/sign-in' },
  useSecureCookies: secureCookies,
  providers: [
    CredentialsProvider({
      name: 'E-mail and password',
      credentials: { email: { label: 'E-mail', type: 'email' }, password: { label: 'Password', type: 'password' } },
      async authorize(raw, req) {
        const parsed = credentialsSchema.safeParse(raw);
        if (!parsed.success) return null;
        const email = normalizeEmail(parsed.data.email);
        const ip = clientAddress(req?.headers ?? {});
        const keys = throttleKeys(email, ip);
        const user = await findUserByEmail(email);
        // Always pay for one bcrypt comparison, known user or not, throttled or not.
        const ok = await checkPassword(parsed.data.password, user?.password_hash);
        if ((await isThrottled(keys)) || !ok || !user) {
          await recordFailure(keys);
          await writeAudit({ userId: user?.id ?? null, action: 'signin_failed', target: email, ip });
          return null;
        }
        await clearFailures(keys[0].key);
        await writeAudit({ userId: user.id, action: 'signin', target: email, ip });
        return { id: String(user.id), email: user.email, name: user.name };
      },
    }),
  ],
  callbacks: {
    // authAt: when the password was checked. It survives the token's rolling renewals, so a
    // password change (lib/auth/guard.ts) ends every session signed in before it.
    async jwt({ token, user }) {
      if (user) {
        token.sub = user.id;
        token.authAt = Date.now();
      }
      return token;
    },
    async session({ session, token }) {
      if (session.user) Object.assign(session.user, { id: token.sub, authAt: typeof token.authAt === 'number' ? token.authAt : 0 });
      return session;
    },
  },
};
}
