import { withAuth } from 'next-auth/middleware';

// Convenience only: signed-out visitors of app pages go to sign-in. Every route handler
// and server action checks the session and the role itself (lib/auth/guard.ts).
export default withAuth({ pages: { signIn: '/sign-in' } });

export const config = {
  matcher: ['/fleet/:path*', '/nodes/:path*', '/alerts/:path*', '/sites/:path*', '/planner/:path*', '/bench/:path*', '/team/:path*', '/settings/:path*', '/account/:path*'],
};
