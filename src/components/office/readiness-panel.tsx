// Every readiness check of a case: light (word and icon), the staff reading, what would clear
// it, the figures it computed and the source it rests on.
import { useState } from 'react';
import type { CheckResult } from '@/lib/readiness/types';
import { ChevronDownIcon } from '@/components/icons';
import { CheckFigures } from './check-figures';
import { LightBadge } from '@/components/readiness/light-badge';

export function ReadinessPanel({ checks }: { checks: CheckResult[] }) {
  // Blocking checks open with their figures; the rest show their reading and open on demand.
  const [allOpen, setAllOpen] = useState<boolean | null>(null);
  const reds = checks.filter((c) => c.light === 'red').length;
  const ambers = checks.filter((c) => c.light === 'amber').length;
  return (
    <section aria-labelledby="checks-heading" className="card p-0" id="checks">
      <div className="flex flex-wrap items-baseline justify-between gap-2 border-b border-ground-100 px-4 py-3">
        <h2 id="checks-heading" className="text-lg font-bold text-ground-900">Readiness checks</h2>
        <p className="text-sm text-ground-700">
          {reds} blocked · {ambers} needing attention · {checks.length - reds - ambers} clear
          <button type="button" className="ml-3 font-semibold text-ground-700 underline decoration-ground-300 underline-offset-2" onClick={() => setAllOpen((v) => !(v ?? false))}>
            {allOpen ? 'Hide all figures' : 'Show all figures'}
          </button>
        </p>
      </div>
      <ul className="divide-y divide-ground-100" data-testid="checks">
        {checks.map((c) => (
          <li key={c.id} data-testid={`check-${c.id}`} data-light={c.light}>
            <details className="group" open={allOpen ?? c.light === 'red'} key={String(allOpen)}>
              <summary className="flex cursor-pointer list-none flex-col gap-1 px-4 py-3 hover:bg-paper sm:flex-row sm:items-start sm:gap-3 [&::-webkit-details-marker]:hidden">
                <span className="shrink-0 pt-0.5 sm:w-40"><LightBadge light={c.light} /></span>
                <span className="min-w-0 flex-1">
                  <span className="block font-semibold text-ground-900">{c.title}</span>
                  <span className="block text-sm text-ground-800">{c.staffText}</span>
                </span>
                <ChevronDownIcon className="mt-1 hidden h-4 w-4 text-ground-500 sm:block transition-transform group-open:rotate-180" />
              </summary>
              <div className="space-y-3 px-4 pb-4 sm:pl-[12.75rem]">
                {c.actions.length > 0 && (
                  <div className="text-sm">
                    <p className="font-semibold text-ground-800">To clear it</p>
                    <ul className="list-disc pl-5">{c.actions.map((a) => <li key={a}>{a}</li>)}</ul>
                  </div>
                )}
                <CheckFigures check={c} />
                <p className="text-xs text-ground-600"><span className="font-semibold">Source:</span> {c.source}</p>
              </div>
            </details>
          </li>
        ))}
      </ul>
    </section>
  );
}
