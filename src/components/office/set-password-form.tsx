// A new member of staff chooses their password from the one-time link in their invitation.
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { setPasswordSchema } from '@/lib/schemas/office';
import { CheckIcon, SpinnerIcon, StopIcon } from '@/components/icons';
import { apiCall } from './api';

const formSchema = setPasswordSchema
  .extend({ confirm: z.string() })
  .refine((v) => v.password === v.confirm, { path: ['confirm'], message: 'The two passwords are not the same.' });
type FormValues = z.infer<typeof formSchema>;

type Props = { email: string; token: string };

export default function SetPasswordForm({ email, token }: Props) {
  const { register, handleSubmit, formState } = useForm<FormValues>({ resolver: zodResolver(formSchema), defaultValues: { password: '', confirm: '' } });
  const [done, setDone] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const linkBroken = !email || !/^[0-9a-f]{64}$/.test(token);

  const submit = handleSubmit(async ({ password }) => {
    setError(null);
    const r = await apiCall<{ ok: true }>('POST', '/api/staff/password', { email, token, password });
    if (r.ok) setDone(true);
    else setError(r.error.fields?.password ?? r.error.message);
  });

  if (linkBroken) {
    return (
      <div role="alert" className="card flex items-start gap-3">
        <StopIcon className="mt-0.5 h-6 w-6 text-blocked" />
        <p>This link is incomplete. Open it again from your invitation e-mail, or ask an admin to invite you again.</p>
      </div>
    );
  }
  if (done) {
    return (
      <div className="card" data-testid="password-set">
        <p className="flex items-center gap-2 text-lg font-bold text-ground-900"><CheckIcon className="h-6 w-6 text-clear" />Your password is set</p>
        <p className="mt-1 text-ground-800">Sign in as installer staff with {email} and your new password.</p>
        <a href="/signin" className="btn-primary mt-4">Go to sign in</a>
      </div>
    );
  }
  const err = formState.errors;
  return (
    <form method="post" onSubmit={submit} noValidate className="card space-y-4">
      <p className="text-ground-800">Choose a password for <span className="break-all font-semibold">{email}</span>. Use at least 12 characters — a few unrelated words work well.</p>
      {error && <p role="alert" className="flex items-start gap-2 rounded-md border border-blocked/30 bg-blocked-soft p-3 text-blocked"><StopIcon className="mt-0.5 h-5 w-5" />{error}</p>}
      <input type="email" autoComplete="username" value={email} readOnly hidden />
      <div>
        <label htmlFor="new-password" className="field-label">New password</label>
        <input id="new-password" type="password" autoComplete="new-password" className="field-input" aria-invalid={!!err.password} aria-describedby={err.password ? 'new-password-error' : undefined} {...register('password')} />
        {err.password && <p id="new-password-error" className="field-error">{err.password.message}</p>}
      </div>
      <div>
        <label htmlFor="confirm-password" className="field-label">The same password again</label>
        <input id="confirm-password" type="password" autoComplete="new-password" className="field-input" aria-invalid={!!err.confirm} aria-describedby={err.confirm ? 'confirm-password-error' : undefined} {...register('confirm')} />
        {err.confirm && <p id="confirm-password-error" className="field-error">{err.confirm.message}</p>}
      </div>
      <button type="submit" className="btn-primary w-full" disabled={formState.isSubmitting}>
        {formState.isSubmitting && <SpinnerIcon className="h-5 w-5" />}Set my password
      </button>
    </form>
  );
}
