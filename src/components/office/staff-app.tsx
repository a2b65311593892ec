// Staff accounts: who can sign in to the office or the surveyor's pages, inviting new staff
// (they get a choose-your-password e-mail) and deactivating or reactivating accounts.
import { useEffect, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { staffInviteSchema } from '@/lib/schemas/office';
import { CheckIcon, CircleIcon, SendIcon, SpinnerIcon } from '@/components/icons';
import { apiCall } from './api';
import { formatDay } from './format';

type Staff = { id: string; name: string | null; email: string; role: 'admin' | 'surveyor'; active: boolean; createdAt?: string };
type StaffInviteInput = z.input<typeof staffInviteSchema>;
type StaffInvite = z.output<typeof staffInviteSchema>;

const roleWords = { admin: 'Office admin', surveyor: 'Surveyor' } as const;

function InviteStaff({ onInvited }: { onInvited(s: Staff): void }) {
  const { register, handleSubmit, formState, setError, reset } = useForm<StaffInviteInput, unknown, StaffInvite>({
    resolver: zodResolver(staffInviteSchema),
    defaultValues: { name: '', email: '', role: 'surveyor' },
  });
  const [sent, setSent] = useState<string | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const submit = handleSubmit(async (values) => {
    setSent(null);
    setFailure(null);
    const r = await apiCall<Staff>('POST', '/api/staff', values);
    if (r.ok) {
      onInvited(r.data);
      setSent(`${values.name} has been e-mailed a link to choose a password.`);
      reset();
      return;
    }
    const fields = r.error.fields ?? {};
    for (const [k, v] of Object.entries(fields)) if (k === 'name' || k === 'email' || k === 'role') setError(k, { message: v });
    if (Object.keys(fields).length === 0) setFailure(r.error.message);
  });
  const err = formState.errors;
  return (
    <section aria-labelledby="invite-staff-heading" className="card">
      <h2 id="invite-staff-heading" className="text-xl font-bold text-ground-900">Add a member of staff</h2>
      <p className="mb-3 text-sm text-ground-800">Admins work the queue, invite customers and change settings. Surveyors see the cases booked to them.</p>
      {sent && <p role="status" className="mb-3 flex items-center gap-2 rounded-md border border-clear/30 bg-clear-soft p-2 text-sm font-semibold" data-testid="staff-invited"><CheckIcon className="h-4 w-4 text-clear" />{sent}</p>}
      {failure && <p role="alert" className="mb-3 rounded-md border border-blocked/30 bg-blocked-soft p-2 text-sm font-semibold text-blocked">{failure}</p>}
      <form method="post" onSubmit={submit} noValidate className="grid gap-3">
        <div>
          <label htmlFor="staff-name" className="field-label">Name</label>
          <input id="staff-name" className="field-input" autoComplete="off" aria-invalid={!!err.name} aria-describedby={err.name ? 'staff-name-error' : undefined} {...register('name')} />
          {err.name && <p id="staff-name-error" className="field-error">{err.name.message}</p>}
        </div>
        <div>
          <label htmlFor="staff-email" className="field-label">E-mail address</label>
          <input id="staff-email" type="email" className="field-input" autoComplete="off" aria-invalid={!!err.email} aria-describedby={err.email ? 'staff-email-error' : undefined} {...register('email')} />
          {err.email && <p id="staff-email-error" className="field-error">{err.email.message}</p>}
        </div>
        <fieldset>
          <legend className="field-label">Role</legend>
          <div className="flex flex-wrap gap-4">
            {(['surveyor', 'admin'] as const).map((role) => (
              <label key={role} className="flex min-h-[44px] items-center gap-2">
                <input type="radio" value={role} className="h-4 w-4 accent-ground-700" {...register('role')} />
                {roleWords[role]}
              </label>
            ))}
          </div>
          {err.role && <p className="field-error">{err.role.message}</p>}
        </fieldset>
        <div>
          <button type="submit" className="btn-primary" disabled={formState.isSubmitting}>
            {formState.isSubmitting ? <SpinnerIcon className="h-5 w-5" /> : <SendIcon className="h-5 w-5" />}Send the invitation
          </button>
        </div>
      </form>
    </section>
  );
}

export default function StaffApp({ currentUserId }: { currentUserId: string }) {
  const [staff, setStaff] = useState<Staff[] | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busyId, setBusyId] = useState<string | null>(null);

  useEffect(() => {
    apiCall<{ items: Staff[] }>('GET', '/api/staff').then((r) => (r.ok ? setStaff(r.data.items) : setError(r.error.message)));
  }, []);

  async function setActive(s: Staff, active: boolean) {
    setBusyId(s.id);
    setError(null);
    const r = await apiCall<Staff>('PATCH', `/api/staff/${s.id}`, { active });
    setBusyId(null);
    if (r.ok) setStaff((list) => list?.map((x) => (x.id === s.id ? { ...x, ...r.data } : x)) ?? null);
    else setError(r.error.message);
  }

  return (
    <div className="grid gap-5 lg:grid-cols-[minmax(0,1fr)_24rem] lg:items-start">
      <section aria-labelledby="staff-heading" className="card min-w-0 p-0">
        <h2 id="staff-heading" className="border-b border-ground-100 px-4 py-3 text-xl font-bold text-ground-900">Staff accounts</h2>
        {error && <p role="alert" className="m-4 rounded-md border border-blocked/30 bg-blocked-soft p-2 text-sm font-semibold text-blocked">{error}</p>}
        {!staff && !error && <p className="flex items-center gap-2 p-4 text-sm"><SpinnerIcon className="h-4 w-4" />Loading staff…</p>}
        {staff && (
          // A list rather than a table: on a phone each account stacks, on a wide screen it lines up in columns.
          <ul className="divide-y divide-ground-100" data-testid="staff-table">
            <li className="hidden bg-ground-50 px-4 py-2 text-sm font-semibold text-ground-800 sm:grid sm:grid-cols-[minmax(0,1fr)_8rem_9rem_9rem] sm:gap-3" aria-hidden="true">
              <span>Name</span><span>Role</span><span>Status</span><span />
            </li>
            {staff.map((s) => (
              <li key={s.id} className="grid grid-cols-[minmax(0,1fr)_auto] gap-x-3 gap-y-1 px-4 py-3 text-sm sm:grid-cols-[minmax(0,1fr)_8rem_9rem_9rem] sm:items-center" data-testid="staff-row">
                <div className="min-w-0">
                  <div className="font-semibold text-ink">{s.name ?? '—'}{s.id === currentUserId && <span className="ml-1 text-xs font-normal text-ground-600">(you)</span>}</div>
                  <div className="break-all text-ground-600">{s.email}</div>
                </div>
                <div className="text-ground-800 sm:order-none"><span className="sr-only">Role: </span>{roleWords[s.role]}</div>
                <div>
                  {s.active ? (
                    <span className="inline-flex items-center gap-1 font-semibold text-clear"><CheckIcon className="h-4 w-4" />Active</span>
                  ) : (
                    <span className="inline-flex items-center gap-1 font-semibold text-ground-600"><CircleIcon className="h-4 w-4" />Deactivated</span>
                  )}
                  {s.createdAt && <div className="text-xs text-ground-600">Since {formatDay(s.createdAt)}</div>}
                </div>
                <div className="sm:text-right">
                  {s.id === currentUserId ? (
                    <span className="text-xs text-ground-600">Your own account</span>
                  ) : (
                    <button
                      type="button"
                      className="btn-secondary min-h-[36px] px-3 py-1 text-sm"
                      disabled={busyId === s.id}
                      onClick={() => setActive(s, !s.active)}
                      aria-label={`${s.active ? 'Deactivate' : 'Reactivate'} ${s.name ?? s.email}`}
                    >
                      {busyId === s.id && <SpinnerIcon className="h-4 w-4" />}{s.active ? 'Deactivate' : 'Reactivate'}
                    </button>
                  )}
                </div>
              </li>
            ))}
          </ul>
        )}
        <p className="border-t border-ground-100 px-4 py-3 text-xs text-ground-600">A deactivated account cannot sign in; its cases and history stay as they are.</p>
      </section>
      <InviteStaff onInvited={(s) => setStaff((list) => [...(list ?? []), s].sort((a, b) => (a.name ?? '').localeCompare(b.name ?? '')))} />
    </div>
  );
}
