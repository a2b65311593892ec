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
import { findActiveUser, findUserByEmail, normaliseEmail } from './src/lib/server/users.server';

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
        const user = await findUserByEmail(parsed.data.email);
        const ok = await verifyPassword(parsed.data.password, user?.passwordHash);
        if (!user || !ok || !user.active || user.role === 'customer') return null;
        return { id: user.id, email: user.email, name: user.name };
      },
    }),
    Nodemailer({
      server: { host: config.smtp.host, port: config.smtp.port },
      from: config.mailFrom,
      maxAge: 60 * 60 * 24,
      normalizeIdentifier: normaliseEmail,
      async sendVerificationRequest({ identifier, url }) {
        await sendMail({ to: identifier, ...signInLinkEmail(url) });
      },
    }),
  ],
  callbacks: {
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
      if (user?.id) {
        token.uid = user.id;
        token.role = (await findActiveUser(user.id))?.role;
      }
      return token;
    },
    async session({ session, token }) {
      if (session.user && typeof token.uid === 'string') {
        Object.assign(session.user, { id: token.uid, role: token.role });
      }
      return session;
    },
  },
});
