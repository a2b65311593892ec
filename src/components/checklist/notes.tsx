// Boxes of words that stand beside fields: longer help, safety cautions, gentle notes.
import type { ReactNode } from 'react';
import { InfoIcon, StopIcon, WarningIcon } from '@/components/icons';

/** A safety caution, always with the stop icon and the word "Safety". */
export function Caution({ children, title = 'Safety' }: { children: ReactNode; title?: string }) {
  return (
    <div className="flex gap-3 rounded-lg border-l-4 border-blocked bg-blocked-soft p-4 text-ink" role="note">
      <StopIcon className="mt-0.5 h-6 w-6 text-blocked" />
      <div>
        <p className="font-bold text-blocked">{title}</p>
        <div className="mt-1 space-y-1">{children}</div>
      </div>
    </div>
  );
}

/** A note worth reading but not a danger, e.g. what a tenant will need. */
export function Note({ children, tone = 'info' }: { children: ReactNode; tone?: 'info' | 'attention' }) {
  const look = tone === 'attention' ? 'border-attention bg-attention-soft' : 'border-ground-400 bg-ground-50';
  return (
    <div className={`flex gap-3 rounded-lg border-l-4 p-4 text-ink ${look}`}>
      {tone === 'attention' ? <WarningIcon className="mt-0.5 h-5 w-5 text-attention" /> : <InfoIcon className="mt-0.5 h-5 w-5 text-ground-600" />}
      <div className="space-y-1">{children}</div>
    </div>
  );
}

/** Help that opens on demand, so the step stays short on a phone. */
export function MoreHelp({ summary, children }: { summary: string; children: ReactNode }) {
  return (
    <details className="group mt-2 rounded-md border border-ground-100 bg-ground-50/60">
      <summary className="flex min-h-[44px] cursor-pointer list-none items-center gap-2 px-3 py-2 font-semibold text-ground-700 [&::-webkit-details-marker]:hidden">
        <InfoIcon className="h-5 w-5 text-ground-600" />
        <span className="flex-1">{summary}</span>
        <span className="text-sm font-normal text-ground-600 group-open:hidden">Show</span>
        <span className="hidden text-sm font-normal text-ground-600 group-open:inline">Hide</span>
      </summary>
      <div className="space-y-2 px-3 pb-3 text-ground-800">{children}</div>
    </details>
  );
}
