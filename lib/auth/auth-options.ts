import 'server-only';
import type { NextAuthOptions } from 'next-auth';
import CredentialsProvider from 'next-auth/providers/credentials';
import { z } from 'zod';
import { CLIENT_ADDRESS_HEADER } from '../http/client-address';
import { authSecret, env } from '../platform/env';
import { verifyPassword } from './passwords';
import { clearSignInFailures, isSignInLocked, recordSignInFailure, signInKeys } from '../data/sign-in-throttle';
import { checkSession, findAccountForSignIn, openSession, revokeSession } from '../data/session-store';
import { sessionClaimsOf } from './session';
import type { Role } from '@/models/user';

const credentialsSchema = z.object({
  email: z.string().trim().toLowerCase().email().max(254),
  password: z.string().min(1).max(200),
});

/** The one message for every failed sign-in: it never says whether the account exists. */
export const SIGN_IN_FAILED = 'That e-mail and password do not match an account.';
export const SIGN_IN_LOCKED = 'Too many failed attempts. Wait 15 minutes, then try again.';

let warnedNoClientAddress = false;

/**
 * The address the server saw, from scripts/serve.ts (lib/http/client-address.ts): never the client's own
 * X-Forwarded-For. Started another way (plain `next start`), production has no trustworthy address,
 * so every client shares one and the per-account limits still hold; `next dev` uses Next's header.
 */
export function clientAddress(headers: Record<string, unknown> | undefined): string {
  const resolved = headers?.[CLIENT_ADDRESS_HEADER];
  if (typeof resolved === 'string' && resolved) return resolved;
  if (env.NODE_ENV !== 'production') {
    const forwarded = headers?.['x-forwarded-for'];
    return (typeof forwarded === 'string' ? forwarded.split(',')[0]?.trim() : undefined) || 'local';
  }
  if (!warnedNoClientAddress) {
    warnedNoClientAddress = true;
    console.warn('[auth] no client address: start the app with scripts/serve.ts (npm start / npm run serve) so sign-in throttling is per address');
  }
  return 'unknown';
}

export const authOptions: NextAuthOptions = {
  secret: authSecret(),
  // The cookie lives no longer than the absolute lifetime; lib/data/session-store decides whether it still stands.
  session: { strategy: 'jwt', maxAge: env.EVENLOAD_SESSION_MAX_AGE_S },
  pages: { signIn: '/sign-in', error: '/sign-in' },
  // Secure, prefixed cookies whenever the public address is https (production behind TLS).
  useSecureCookies: (env.NEXTAUTH_URL ?? '').startsWith('https://'),
  providers: [
    CredentialsProvider({
      name: 'E-mail and password',
      credentials: { email: { label: 'E-mail', type: 'email' }, password: { label: 'Password', type: 'password' } },
      async authorize(raw, request) {
        const parsed = credentialsSchema.safeParse(raw);
        if (!parsed.success) throw new Error(SIGN_IN_FAILED);
        const { email, password } = parsed.data;
        const keys = signInKeys(email, clientAddress(request?.headers));
        if (await isSignInLocked(keys)) throw new Error(SIGN_IN_LOCKED);
        const user = await findAccountForSignIn(email);
        const ok = await verifyPassword(password, user?.passwordHash);
        if (!user || !ok || !user.isActive) {
          await recordSignInFailure(keys);
          throw new Error(SIGN_IN_FAILED);
        }
        await clearSignInFailures(keys);
        return { id: String(user.id), name: user.name, email: user.email, role: user.role, units: user.preferredUnits, sessionVersion: user.sessionVersion };
      },
    }),
  ],
  callbacks: {
    /**
     * At sign-in: opens the server-side session and puts its claims in the token. On every renewal
     * (GET /api/auth/session): the session must still stand (lib/data/session-store), or the renewal
     * fails and next-auth clears the cookie; the sign-in time is copied, so renewal never extends the
     * absolute lifetime.
     */
    async jwt({ token, user }) {
      if (user) {
        const u = user as unknown as { id: string; role: Role; units: 'si' | 'us'; sessionVersion: number };
        Object.assign(token, await openSession(Number(u.id), u.sessionVersion), { role: u.role, units: u.units });
        return token;
      }
      const claims = sessionClaimsOf(token);
      const account = claims ? await checkSession(claims) : null;
      if (!account) throw new SessionEndedError();
      return Object.assign(token, { name: account.name, email: account.email, role: account.role, units: account.units });
    },
    async session({ session, token }) {
      session.user = {
        ...session.user,
        id: token.uid as number,
        role: token.role as Role,
        units: (token.units as 'si' | 'us') ?? 'si',
      };
      return session;
    },
  },
  events: {
    /** Sign-out revokes the session on the server: a copy of the cookie is refused afterwards. */
    async signOut({ token }) {
      const claims = sessionClaimsOf(token);
      if (claims) await revokeSession(claims.sid);
    },
  },
  logger: {
    // An ended session is an expected answer, not a server error worth a stack trace.
    error(code, metadata) {
      if (code === 'JWT_SESSION_ERROR' && metadata instanceof SessionEndedError) return;
      console.error(`[next-auth] ${code}`, metadata);
    },
    warn(code) {
      console.warn(`[next-auth] ${code}`);
    },
    debug() {},
  },
};

/** Thrown by the renewal of a session that has ended (next-auth then clears the cookie). */
class SessionEndedError extends Error {
  constructor() {
    super('The session has ended.');
  }
}
