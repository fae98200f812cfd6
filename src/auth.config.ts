import Credentials from '@auth/core/providers/credentials';
import type { AuthConfig } from '@auth/core';
import { verifyCredentials } from './server/auth/credentials';
import { getConfig } from './server/config';
import { SESSION_LIFETIME_SECONDS } from './server/session';

/**
 * Auth.js settings. The secret and trustHost are read from the environment when a request
 * comes in, never at build time, so the secret cannot end up in the build output.
 */
/** auth-astro's routes live under /api/auth; Auth.js needs the same path as its basePath. */
const config: AuthConfig & { prefix: string } = {
  prefix: '/api/auth',
  basePath: '/api/auth',
  providers: [
    Credentials({
      credentials: { email: { label: 'E-mail', type: 'email' }, password: { label: 'Password', type: 'password' } },
      authorize: (credentials) => verifyCredentials(credentials),
    }),
  ],
  session: { strategy: 'jwt', maxAge: SESSION_LIFETIME_SECONDS },
  pages: { signIn: '/signin', error: '/signin', signOut: '/signout' },
  callbacks: {
    jwt({ token, user }) {
      if (user?.id) {
        token.sub = user.id;
        token.authTime = Date.now();
        token.epoch = (user as { sessionEpoch?: number }).sessionEpoch ?? 0;
      }
      const authTime = Number(token.authTime);
      if (!Number.isFinite(authTime) || Date.now() - authTime > SESSION_LIFETIME_SECONDS * 1000) return null;
      return token;
    },
    session({ session, token }) {
      if (session.user && token.sub) session.user.id = token.sub;
      return session;
    },
  },
};

Object.defineProperty(config, 'secret', { get: () => getConfig().AUTH_SECRET, enumerable: true });
Object.defineProperty(config, 'trustHost', { get: () => getConfig().AUTH_TRUST_HOST, enumerable: true });

export default config;
