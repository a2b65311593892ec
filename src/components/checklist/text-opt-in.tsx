// Reminders by text: an explicit, separate yes (never pre-ticked), for a UK mobile, that the
// customer can take back here or by replying STOP. Hidden when the installer has texts off.
import { useEffect, useId, useState } from 'react';
import { checkUkMobile } from '@/lib/validation/phone';
import { SpinnerIcon } from '@/components/icons';
import { agreeToTexts, loadTexts, stopTexts, type TextsOutcome, type TextsView } from './services-client';
import { useFieldValue } from './fields';

const when = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', year: 'numeric', hour: '2-digit', minute: '2-digit', timeZone: 'Europe/London' });

function displayMobile(e164: string): string {
  const m = checkUkMobile(e164);
  return m.ok ? m.display : e164;
}

export function TextOptIn({ caseId }: { caseId: string }) {
  const id = useId();
  const phone = useFieldValue('about.phone');
  const [view, setView] = useState<TextsView | null>(null);
  const [mobile, setMobile] = useState('');
  const [agree, setAgree] = useState(false);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [busy, setBusy] = useState(false);

  useEffect(() => {
    void loadTexts(caseId).then((r) => r.kind === 'ok' && setView(r.view));
  }, [caseId]);
  // Offer the contact number when it is a mobile, until they type one of their own.
  useEffect(() => {
    const m = checkUkMobile(phone);
    if (m.ok && mobile === '') setMobile(m.display);
  }, [phone]); // eslint-disable-line react-hooks/exhaustive-deps

  if (!view?.enabled) return null;

  function settle(r: TextsOutcome) {
    setBusy(false);
    if (r.kind === 'ok') {
      setView(r.view);
      setErrors({});
      setAgree(false);
    } else if (r.kind === 'invalid') setErrors(r.fields);
    else setErrors({ form: r.message });
  }
  async function turnOn() {
    if (!agree) return setErrors({ agree: 'Please tick the box to agree to text messages.' });
    setBusy(true);
    settle(await agreeToTexts(caseId, mobile));
  }
  async function turnOff() {
    setBusy(true);
    settle(await stopTexts(caseId));
  }

  return (
    <section className="space-y-3 rounded-lg border border-ground-100 p-4" aria-labelledby={`${id}-h`} data-testid="text-opt-in">
      <h3 id={`${id}-h`} className="text-lg font-bold text-ground-900">Reminders by text (optional)</h3>
      {view.consented ? (
        <>
          <p className="text-ground-800" data-testid="texts-on">
            Texts are on, to <strong>{displayMobile(view.mobile ?? '')}</strong>, since{' '}
            {view.consentedAt ? when.format(new Date(view.consentedAt)) : ''}. You can also reply STOP to any text.
          </p>
          <button type="button" className="btn-secondary" onClick={turnOff} disabled={busy}>
            {busy && <SpinnerIcon className="h-4 w-4" />}Stop texts
          </button>
        </>
      ) : (
        <>
          <p className="field-help mt-0">
            We can text you as well as e-mail when something is still needed, with a link back to your checklist. Never at night, and only
            alongside an e-mail, never more often.{view.withdrawnAt ? ' You stopped texts earlier; you can turn them on again here.' : ''}
          </p>
          <div>
            <label htmlFor={`${id}-mobile`} className="field-label">Mobile number for texts</label>
            <input
              id={`${id}-mobile`}
              className={`field-input max-w-[14rem] ${errors.mobile ? 'border-blocked' : ''}`}
              type="tel"
              inputMode="tel"
              autoComplete="tel"
              value={mobile}
              aria-invalid={errors.mobile ? true : undefined}
              aria-describedby={errors.mobile ? `${id}-mobile-error` : undefined}
              onChange={(e) => setMobile(e.target.value)}
            />
            {errors.mobile && <p id={`${id}-mobile-error`} className="field-error">{errors.mobile}</p>}
          </div>
          <label className="flex min-h-[48px] cursor-pointer items-start gap-3 rounded-lg border-2 border-ground-100 bg-white p-3 has-[:checked]:border-ground-600 has-[:checked]:bg-ground-50">
            <input type="checkbox" className="mt-0.5 h-5 w-5 shrink-0 accent-ground-700" checked={agree} onChange={(e) => setAgree(e.target.checked)} aria-describedby={errors.agree ? `${id}-agree-error` : undefined} />
            <span>Yes, text me reminders about this checklist at this number. I can reply STOP at any time.</span>
          </label>
          {errors.agree && <p id={`${id}-agree-error`} className="field-error">{errors.agree}</p>}
          {errors.form && <p className="field-error">{errors.form}</p>}
          <button type="button" className="btn-secondary" onClick={turnOn} disabled={busy}>
            {busy && <SpinnerIcon className="h-4 w-4" />}Turn on text reminders
          </button>
        </>
      )}
    </section>
  );
}
