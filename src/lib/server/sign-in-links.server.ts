// Server-only: one-time sign-in links for e-mails we send ourselves (invitations, chasers).
// They are ordinary Auth.js e-mail tokens, made the way Auth.js makes them (SHA-256 of token +
// secret stored in verification_tokens), so the same callback route signs the customer in.
import { randomBytes, createHash } from 'node:crypto';
import { verificationTokens } from '@/db/schema';
import { config } from './config.server';
import { db } from './db.server';

/**
 * A link that signs the customer in once and lands them on `next`.
 * @example await signInLink('customer@example.com', { days: 7, next: '/my' })
 */
export async function signInLink(email: string, { days = 7, next = '/home' } = {}): Promise<string> {
  const token = randomBytes(32).toString('hex');
  const hashed = createHash('sha256').update(`${token}${config.authSecret}`).digest('hex');
  await db()
    .insert(verificationTokens)
    .values({ identifier: email, token: hashed, expires: new Date(Date.now() + days * 86_400_000) });
  const params = new URLSearchParams({ callbackUrl: `${config.appUrl}${next}`, token, email });
  return `${config.appUrl}/api/auth/callback/nodemailer?${params}`;
}
