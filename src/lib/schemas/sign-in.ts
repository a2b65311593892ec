// Client-safe: the sign-in forms' schemas, shared by the island and the server.
import { z } from 'zod';

export const emailField = z
  .string({ required_error: 'Enter your e-mail address.' })
  .trim()
  .min(1, 'Enter your e-mail address.')
  .max(254, 'That e-mail address is too long.')
  .email('Enter an e-mail address like name@example.com.');

export const linkSignInSchema = z.object({ email: emailField });
export const passwordSignInSchema = z.object({
  email: emailField,
  password: z.string().min(1, 'Enter your password.').max(200, 'That password is too long.'),
});

export type LinkSignIn = z.infer<typeof linkSignInSchema>;
export type PasswordSignIn = z.infer<typeof passwordSignInSchema>;

/** Plain words for the error codes Auth.js puts in its redirects. */
export const signInErrorMessages: Record<string, string> = {
  Verification: 'That sign-in link has expired or has already been used. Ask for a new one below.',
  CredentialsSignin: "That e-mail and password don't match an active staff account.",
  AccessDenied: "That account can't sign in this way. Customers: use the e-mailed link. Staff: use your password.",
  Configuration: 'Sign-in is not working right now. Please try again in a few minutes.',
  SessionRequired: 'Please sign in to see that page.',
};
