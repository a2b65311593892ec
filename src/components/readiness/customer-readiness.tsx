// The customer's view of the readiness checks, in plain words: what is clear, what needs
// attention and what is holding the job up — fetched fresh whenever the answers change.
import { useEffect, useState } from 'react';
import type { CheckId, Light } from '@/lib/readiness/types';
import { lightRank } from '@/lib/readiness/lights';
import type { CustomerAction } from '@/lib/vocabulary/readiness';
import { SpinnerIcon } from '@/components/icons';
import { LightBadge } from './light-badge';

/** A check as the server hands it to a customer: their own words and where they can act. */
type CustomerCheck = { id: CheckId; light: Light; title: string; customerText: string; customerActions: CustomerAction[] };
type Readiness = { light: Light; gapCount: number; checks: CustomerCheck[] };

function actionHref(caseId: string, action: CustomerAction): string {
  return action.place === 'photos' ? `/my/cases/${caseId}/photos` : `#step=${action.place}`;
}

const order = lightRank;

export default function CustomerReadiness({ caseId, version }: { caseId: string; version: number }) {
  const [data, setData] = useState<Readiness | null>(null);
  const [failed, setFailed] = useState(false);
  useEffect(() => {
    let live = true;
    fetch(`/api/cases/${caseId}/readiness`)
      .then((r) => (r.ok ? (r.json() as Promise<Readiness>) : Promise.reject(new Error(String(r.status)))))
      .then((d) => live && (setData(d), setFailed(false)))
      .catch(() => live && setFailed(true));
    return () => {
      live = false;
    };
  }, [caseId, version]);

  if (failed) return <p className="text-ground-700">We couldn’t load the checks just now. They’ll show when you next open this page.</p>;
  if (!data) {
    return (
      <p className="flex items-center gap-2 text-ground-700">
        <SpinnerIcon className="h-4 w-4" /> Checking your answers…
      </p>
    );
  }
  const checks = [...data.checks].sort((a, b) => order[a.light] - order[b.light]);
  return (
    <section aria-labelledby="readiness-heading" className="rounded-lg border border-ground-100 bg-white" data-testid="customer-readiness">
      <div className="flex flex-wrap items-center justify-between gap-2 border-b border-ground-100 bg-ground-50 px-4 py-3">
        <h3 id="readiness-heading" className="text-lg font-bold text-ground-900">
          What your answers tell your installer
        </h3>
        <LightBadge light={data.light} audience="customer" />
      </div>
      <ul className="divide-y divide-ground-100">
        {checks.map((c) => (
          <li key={c.id} className="px-4 py-3" data-testid={`check-${c.id}`} data-light={c.light}>
            <div className="flex flex-wrap items-center justify-between gap-2">
              <p className="font-semibold text-ground-900">{c.title}</p>
              <LightBadge light={c.light} audience="customer" />
            </div>
            <p className="mt-1 text-ground-800">{c.customerText}</p>
            {c.customerActions.length > 0 && (
              <ul className="mt-1 list-disc pl-5 text-sm text-ground-700" data-testid={`check-${c.id}-actions`}>
                {c.customerActions.map((a) => (
                  <li key={a.text}>
                    <a href={actionHref(caseId, a)}>{a.text}</a>
                  </li>
                ))}
              </ul>
            )}
          </li>
        ))}
      </ul>
      <p className="border-t border-ground-100 px-4 py-3 text-sm text-ground-700">
        These checks help your installer prepare. They are not a design: a qualified electrician decides what is needed under BS 7671 and local rules.
      </p>
    </section>
  );
}
