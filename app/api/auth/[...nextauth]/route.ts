import NextAuth from 'next-auth';
import { authOptions } from '@/lib/auth/options';

// next-auth's own routes (sign-in, sign-out, session, CSRF token), with its CSRF protection.
type Ctx = { params: Promise<{ nextauth: string[] }> };

async function handler(request: Request, context: Ctx) {
  return NextAuth(authOptions())(request, { params: await context.params });
}

export { handler as GET, handler as POST };
