// Invite one customer: the shared invite schema checks the form in the browser and again on the
// server; a duplicate open case answers with a link to it.
import { useState } from 'react';
import { useForm, type FieldPath } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { inviteSchema, type Invite, type InviteInput } from '@/lib/schemas/invite';
import { CheckIcon, SendIcon, SpinnerIcon, WarningIcon } from '@/components/icons';
import { apiCall } from './api';

type Created = { id: string; reference: string };
type Outcome = { kind: 'created'; created: Created; email: string; name: string } | { kind: 'duplicate'; message: string; url: string } | { kind: 'error'; message: string } | null;

type FieldProps = {
  name: FieldPath<InviteInput>;
  label: string;
  type?: string;
  autoComplete?: string;
  help?: string;
  className?: string;
};

export default function InviteForm() {
  const form = useForm<InviteInput, unknown, Invite>({ resolver: zodResolver(inviteSchema), defaultValues: { customer: { name: '', email: '', phone: '' } } });
  const { register, formState, handleSubmit, setError, reset } = form;
  const [outcome, setOutcome] = useState<Outcome>(null);

  const errorOf = (name: string): string | undefined => {
    const parts = name.split('.');
    let node: unknown = formState.errors;
    for (const p of parts) node = (node as Record<string, unknown> | undefined)?.[p];
    const message = (node as { message?: string } | undefined)?.message;
    // The shared e-mail rule speaks to the person signing in; here the office types someone else's.
    return message === 'Enter your e-mail address.' ? 'Enter the customer’s e-mail address.' : message;
  };

  // A plain function, not a component: a component defined here would remount the input on every render.
  function field({ name, label, type = 'text', autoComplete, help, className = '' }: FieldProps) {
    const id = `invite-${name.replace('.', '-')}`;
    const registered = register(name);
    const error = errorOf(name);
    const describedBy = [help ? `${id}-help` : '', error ? `${id}-error` : ''].filter(Boolean).join(' ') || undefined;
    return (
      <div className={className}>
        <label htmlFor={id} className="field-label">{label}</label>
        <input id={id} type={type} autoComplete={autoComplete} className="field-input" aria-invalid={!!error} aria-describedby={describedBy} {...registered} />
        {help && <p id={`${id}-help`} className="field-help">{help}</p>}
        {error && <p id={`${id}-error`} className="field-error">{error}</p>}
      </div>
    );
  }

  const submit = handleSubmit(async (values) => {
    setOutcome(null);
    const r = await apiCall<Created>('POST', '/api/cases', values);
    if (r.ok) {
      setOutcome({ kind: 'created', created: r.data, email: values.customer.email, name: values.customer.name });
      reset();
      return;
    }
    if (r.status === 409 && typeof r.error.url === 'string') {
      setOutcome({ kind: 'duplicate', message: r.error.message, url: r.error.url });
      return;
    }
    for (const [path, message] of Object.entries(r.error.fields ?? {})) setError(path as FieldPath<InviteInput>, { message });
    setOutcome({ kind: 'error', message: r.error.message });
  });

  return (
    <section aria-labelledby="invite-one-heading" className="card">
      <h2 id="invite-one-heading" className="text-xl font-bold text-ground-900">Invite one customer</h2>
      <p className="mb-4 text-ground-800">They get an e-mail with a sign-in link and a short explanation of what they will be asked for. Only the name and e-mail are needed; they can fill in the rest.</p>

      {outcome?.kind === 'created' && (
        <div role="status" className="mb-4 flex items-start gap-3 rounded-md border border-clear/30 bg-clear-soft p-3" data-testid="invite-sent">
          <CheckIcon className="mt-0.5 h-5 w-5 text-clear" />
          <div>
            <p className="font-semibold">Invitation sent to {outcome.name} ({outcome.email}).</p>
            <p>Case <a href={`/office/cases/${outcome.created.id}`} className="font-mono font-semibold">{outcome.created.reference}</a> is open and in the queue.</p>
          </div>
        </div>
      )}
      {outcome?.kind === 'duplicate' && (
        <div role="alert" className="mb-4 flex items-start gap-3 rounded-md border border-attention/30 bg-attention-soft p-3" data-testid="invite-duplicate">
          <WarningIcon className="mt-0.5 h-5 w-5 text-attention" />
          <div>
            <p className="font-semibold">{outcome.message}</p>
            <p><a href={outcome.url}>Open the existing case</a> rather than starting a second one.</p>
          </div>
        </div>
      )}
      {outcome?.kind === 'error' && (
        <p role="alert" className="mb-4 rounded-md border border-blocked/30 bg-blocked-soft p-3 font-semibold text-blocked">{outcome.message}</p>
      )}

      <form method="post" onSubmit={submit} noValidate className="grid gap-4 sm:grid-cols-2">
        {field({ name: 'customer.name', label: 'Customer’s name', autoComplete: 'off' })}
        {field({ name: 'customer.email', label: 'E-mail address', type: 'email', autoComplete: 'off' })}
        {field({ name: 'customer.phone', label: 'Phone (optional)', type: 'tel', autoComplete: 'off', help: 'A UK number, e.g. 0113 496 0123.' })}
        <div className="hidden sm:block" />
        {field({ name: 'address.addressLine1', label: 'Address line 1 (optional)', autoComplete: 'off' })}
        {field({ name: 'address.addressLine2', label: 'Address line 2 (optional)', autoComplete: 'off' })}
        {field({ name: 'address.town', label: 'Town (optional)', autoComplete: 'off' })}
        {field({ name: 'address.postcode', label: 'Postcode (optional)', autoComplete: 'off' })}
        <div className="sm:col-span-2">
          <label htmlFor="invite-note" className="field-label">A line for the invitation (optional)</label>
          <textarea id="invite-note" className="field-input min-h-[80px]" aria-describedby="invite-note-help" {...register('note')} />
          <p id="invite-note-help" className="field-help">For example: “Thanks for calling us on Tuesday — here is the link we mentioned.”</p>
          {errorOf('note') && <p className="field-error">{errorOf('note')}</p>}
        </div>
        <div className="sm:col-span-2">
          <button type="submit" className="btn-primary" disabled={formState.isSubmitting}>
            {formState.isSubmitting ? <SpinnerIcon className="h-5 w-5" /> : <SendIcon className="h-5 w-5" />}
            Send the invitation
          </button>
        </div>
      </form>
    </section>
  );
}
