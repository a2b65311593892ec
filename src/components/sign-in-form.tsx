import { useEffect, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { StopIcon } from './icons';
import {
  linkSignInSchema,
  passwordSignInSchema,
  signInErrorMessages,
  type LinkSignIn,
  type PasswordSignIn,
} from '@/lib/schemas/sign-in';
import { safeCallbackPath } from '@/lib/safe-redirect';

type Props = { initialError?: string | null; callbackUrl?: string };

/** Posts to an Auth.js route with its CSRF token; returns where Auth.js would send us. */
async function authPost(path: string, fields: Record<string, string>): Promise<{ url?: string; error?: string }> {
  const csrf = await fetch('/api/auth/csrf').then((r) => r.json() as Promise<{ csrfToken: string }>);
  const res = await fetch(path, {
    method: 'POST',
    headers: { 'Content-Type': 'application/x-www-form-urlencoded', 'X-Auth-Return-Redirect': '1' },
    body: new URLSearchParams({ ...fields, csrfToken: csrf.csrfToken }),
  });
  const body = (await res.json().catch(() => ({}))) as { url?: string; error?: { message?: string } };
  if (!res.ok) return { error: body.error?.message ?? 'Sign-in failed. Please try again.' };
  const code = body.url ? new URL(body.url, window.location.origin).searchParams.get('error') : null;
  return code ? { error: signInErrorMessages[code] ?? signInErrorMessages.Configuration } : { url: body.url };
}

function ErrorBox({ message }: { message: string }) {
  return (
    <div role="alert" className="mb-4 flex items-start gap-2 rounded-md border border-blocked/30 bg-blocked-soft p-3 text-blocked">
      <StopIcon className="mt-0.5 h-5 w-5 shrink-0" />
      <span>{message}</span>
    </div>
  );
}

export default function SignInForm({ initialError, callbackUrl: wanted = '/home' }: Props) {
  // Checked again here, where the browser navigates: only a path on this very origin.
  const callbackUrl = safeCallbackPath(wanted, typeof window === 'undefined' ? 'http://localhost' : window.location.origin);
  const [mode, setMode] = useState<'customer' | 'staff'>('customer');
  const [error, setError] = useState<string | null>(initialError ? (signInErrorMessages[initialError] ?? signInErrorMessages.Configuration) : null);
  const link = useForm<LinkSignIn>({ resolver: zodResolver(linkSignInSchema) });
  const password = useForm<PasswordSignIn>({ resolver: zodResolver(passwordSignInSchema) });
  // Marks the form as interactive, so tests (and nothing else) can wait for hydration.
  const [ready, setReady] = useState(false);
  useEffect(() => setReady(true), []);

  const sendLink = link.handleSubmit(async ({ email }) => {
    setError(null);
    const r = await authPost('/api/auth/signin/nodemailer', { email, callbackUrl });
    if (r.error) setError(r.error);
    else window.location.assign(safeCallbackPath(r.url, window.location.origin, '/signin/check-email'));
  });
  const signInStaff = password.handleSubmit(async ({ email, password: pw }) => {
    setError(null);
    const r = await authPost('/api/auth/callback/credentials', { email, password: pw, callbackUrl });
    if (r.error) setError(r.error);
    else window.location.assign(callbackUrl);
  });

  const tab = (id: 'customer' | 'staff', label: string) => (
    <button
      type="button"
      role="tab"
      id={`tab-${id}`}
      aria-selected={mode === id}
      aria-controls={`panel-${id}`}
      onClick={() => {
        setMode(id);
        setError(null);
      }}
      className={`flex-1 rounded-md px-3 py-2.5 font-semibold ${mode === id ? 'bg-white text-ground-900 shadow-sm' : 'text-ground-700 hover:bg-ground-50'}`}
    >
      {label}
    </button>
  );

  return (
    <div className="card" data-ready={ready ? 'true' : 'false'}>
      <div role="tablist" aria-label="Who is signing in" className="mb-5 flex gap-1 rounded-lg bg-ground-100 p-1">
        {tab('customer', 'I’m a customer')}
        {tab('staff', 'Installer staff')}
      </div>
      {error && <ErrorBox message={error} />}
      {mode === 'customer' ? (
        <form id="panel-customer" role="tabpanel" aria-labelledby="tab-customer" method="post" onSubmit={sendLink} noValidate>
          <p className="mb-4 text-ground-800">
            Enter the e-mail address your installer invited. We’ll send you a link that signs you in — no password to remember.
          </p>
          <label htmlFor="link-email" className="field-label">E-mail address</label>
          <input
            id="link-email"
            type="email"
            autoComplete="email"
            inputMode="email"
            className="field-input"
            aria-invalid={!!link.formState.errors.email}
            aria-describedby={link.formState.errors.email ? 'link-email-error' : undefined}
            {...link.register('email')}
          />
          {link.formState.errors.email && <p id="link-email-error" className="field-error">{link.formState.errors.email.message}</p>}
          <button type="submit" className="btn-primary mt-5 w-full" disabled={link.formState.isSubmitting}>
            {link.formState.isSubmitting ? 'Sending…' : 'E-mail me a sign-in link'}
          </button>
        </form>
      ) : (
        <form id="panel-staff" role="tabpanel" aria-labelledby="tab-staff" method="post" onSubmit={signInStaff} noValidate>
          <label htmlFor="staff-email" className="field-label">E-mail address</label>
          <input
            id="staff-email"
            type="email"
            autoComplete="username"
            className="field-input"
            aria-invalid={!!password.formState.errors.email}
            aria-describedby={password.formState.errors.email ? 'staff-email-error' : undefined}
            {...password.register('email')}
          />
          {password.formState.errors.email && <p id="staff-email-error" className="field-error">{password.formState.errors.email.message}</p>}
          <label htmlFor="staff-password" className="field-label mt-4">Password</label>
          <input
            id="staff-password"
            type="password"
            autoComplete="current-password"
            className="field-input"
            aria-invalid={!!password.formState.errors.password}
            aria-describedby={password.formState.errors.password ? 'staff-password-error' : undefined}
            {...password.register('password')}
          />
          {password.formState.errors.password && <p id="staff-password-error" className="field-error">{password.formState.errors.password.message}</p>}
          <button type="submit" className="btn-primary mt-5 w-full" disabled={password.formState.isSubmitting}>
            {password.formState.isSubmitting ? 'Signing in…' : 'Sign in'}
          </button>
        </form>
      )}
    </div>
  );
}
