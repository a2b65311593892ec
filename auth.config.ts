// Auth.js configuration, loaded by auth-astro. Staff sign in with e-mail and password;
// customers with a one-time link e-mailed to them. Sessions are JWTs carrying the role.
import Credentials from '@auth/core/providers/credentials';
import Nodemailer from '@auth/core/providers/nodemailer';
import { DrizzleAdapter } from '@auth/drizzle-adapter';
import { defineConfig } from 'auth-astro';
import { z } from 'zod';
import { accounts, sessions, users, verificationTokens } from './src/db/schema';
import { config } from './src/lib/server/config.server';
import { db } from './src/lib/server/db.server';
import { signInLinkEmail } from './src/lib/server/email-templates.server';
import { sendMail } from './src/lib/server/mail.server';
import { verifyPassword } from './src/lib/server/passwords.server';
import { countLinkRequest, countPasswordAttempt } from './src/lib/server/rate-limit.server';
import { newSessionClaims, revokeSession } from './src/lib/server/sessions.server';
import { findUserByEmail, normaliseEmail } from './src/lib/server/users.server';
import { safeCallbackPath } from './src/lib/safe-redirect';

const credentialsSchema = z.object({ email: z.string().email(), password: z.string().min(1).max(200) });

// postgres.js connects on first query, so building the adapter here touches no database.
const adapter = DrizzleAdapter(db(), {
  usersTable: users,
  accountsTable: accounts,
  sessionsTable: sessions,
  verificationTokensTable: verificationTokens,
});

export default defineConfig({
  secret: process.env.AUTH_SECRET,
  trustHost: true,
  adapter,
  session: { strategy: 'jwt', maxAge: 60 * 60 * 24 * 14 },
  pages: { signIn: '/signin', error: '/signin', verifyRequest: '/signin/check-email' },
  providers: [
    Credentials({
      credentials: { email: { label: 'E-mail' }, password: { label: 'Password', type: 'password' } },
      async authorize(raw) {
        const parsed = credentialsSchema.safeParse(raw);
        if (!parsed.success) return null;
        // Counted here, where the attempt happens, so no spelling of the URL gets round it.
        const attempt = await countPasswordAttempt(normaliseEmail(parsed.data.email));
        if (!attempt.allowed) return null;
        const user = await findUserByEmail(parsed.data.email);
        const ok = await verifyPassword(parsed.data.password, user?.passwordHash);
        if (!user || !ok || !user.active || user.role === 'customer') return null;
        await attempt.succeeded();
        return { id: user.id, email: user.email, name: user.name };
      },
    }),
    Nodemailer({
      server: { host: config.smtp.host, port: config.smtp.port },
      from: config.mailFrom,
      maxAge: 60 * 60 * 24,
      normalizeIdentifier: normaliseEmail,
      async sendVerificationRequest({ identifier, url }) {
        // Counted in the sender itself: every route that would mail a link passes here.
        if (!(await countLinkRequest(identifier))) return;
        await sendMail({ to: identifier, ...signInLinkEmail(linkOnAppUrl(url)) });
      },
    }),
  ],
  callbacks: {
    // Only paths on this app, resolved against APP_URL (never the request's Host header).
    redirect({ url }) {
      return `${config.appUrl}${safeCallbackPath(url, config.appUrl)}`;
    },
    async signIn({ user, account, email }) {
      if (account?.provider !== 'nodemailer') return true;
      // Only invited, active customers get links; everyone else sees the same "check your
      // e-mail" page, so the form does not reveal who has an account.
      const known = user.email ? await findUserByEmail(user.email) : undefined;
      const allowed = !!known && known.active && known.role === 'customer';
      if (email?.verificationRequest) return allowed ? true : '/signin/check-email';
      return allowed;
    },
    async jwt({ token, user }) {
      // At sign-in only: the user's id, a fresh session id (so signing out can end just this
      // session) and the user's session version (so "sign out everywhere" ends them all).
      if (user?.id) Object.assign(token, await newSessionClaims(user.id));
      return token;
    },
    async session({ session, token }) {
      if (session.user && typeof token.uid === 'string') {
        // sid and sv let the middleware check that this session has not been ended.
        Object.assign(session.user, { id: token.uid, role: token.role, sid: token.sid, sv: token.sv });
      }
      return session;
    },
  },
  events: {
    async signOut(message) {
      if ('token' in message && message.token) await revokeSession(message.token);
    },
  },
});

/**
 * Auth.js builds the link from the request's Host (or X-Forwarded-Host); anyone can send those.
 * The link always points at APP_URL, carrying only Auth.js's own token, e-mail and a safe callback.
 */
function linkOnAppUrl(url: string): string {
  const made = new URL(url);
  const params = new URLSearchParams({
    callbackUrl: `${config.appUrl}${safeCallbackPath(made.searchParams.get('callbackUrl'), config.appUrl)}`,
    token: made.searchParams.get('token') ?? '',
    email: made.searchParams.get('email') ?? '',
  });
  return `${config.appUrl}/api/auth/callback/nodemailer?${params}`;
}
