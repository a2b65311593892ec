// Whether the cable reaches, one line per way of parking (and per bay when there are two), in
// words with an icon: the colour only repeats what the words say.
import { CheckIcon, InfoIcon, WarningIcon } from '@/components/icons';
import type { CableSource } from '@/lib/readiness/checks/cable-reach';
import type { ReachVerdict } from '@/lib/readiness/plan';
import type { ParkingHabit } from '@/lib/readiness/types';
import { formatNumber } from '@/lib/readiness/units';
import { cableSentence, verdictDetail, verdictSentence, wayLabels } from '@/lib/vocabulary/plan';

type Props = {
  verdicts: readonly ReachVerdict[];
  cable: { metres: number; source: CableSource };
  habit: ParkingHabit | null;
  slackMetres: number;
  /** Bay names by index, shown when more than one bay is measured. */
  bayNames: readonly string[];
  portKnown: boolean;
};

/**
 * The reach verdicts as a list.
 *
 * @example <ReachSummary verdicts={v} cable={{ metres: 5, source: 'tether' }} habit="varies" slackMetres={1} bayNames={['Bay']} portKnown />
 */
export function ReachSummary({ verdicts, cable, habit, slackMetres, bayNames, portKnown }: Props) {
  const severalBays = new Set(verdicts.map((v) => v.bayIndex)).size > 1;
  return (
    <section className="card p-4 sm:p-5" aria-labelledby="plan-reach-heading">
      <h3 id="plan-reach-heading" className="text-lg font-bold text-ground-900">
        Does the cable reach?
      </h3>
      <p className="mt-1 text-ground-800" data-testid="plan-cable-length">
        {cableSentence(cable)}
      </p>
      <div aria-live="polite" className="mt-3">
        {!portKnown ? (
          <p className="flex gap-2 rounded-md border border-ground-200 bg-ground-50 p-3 text-ground-800">
            <InfoIcon className="mt-0.5 h-5 w-5 text-ground-700" />
            <span>Pick where the charging socket is on the car (below) and we’ll show whether the cable reaches.</span>
          </p>
        ) : (
          <ul className="grid gap-2" data-testid="plan-verdicts">
            {verdicts.map((v) => {
              const usual = habit === null || habit === 'varies' || habit === v.way;
              return (
                <li
                  key={`${v.bayIndex}-${v.way}`}
                  data-testid={`plan-verdict-${v.way}${severalBays ? `-${v.bayIndex + 1}` : ''}`}
                  data-reaches={v.reaches}
                  className={`flex gap-3 rounded-md border p-3 ${v.reaches ? 'border-clear/30 bg-clear-soft' : 'border-attention/30 bg-attention-soft'} ${usual ? '' : 'opacity-80'}`}
                >
                  {v.reaches ? <CheckIcon className="mt-0.5 h-6 w-6 text-clear" /> : <WarningIcon className="mt-0.5 h-6 w-6 text-attention" />}
                  <div className="min-w-0">
                    <p className="text-sm font-semibold uppercase tracking-wide text-ground-700">
                      {bayNames.length > 1 ? `${bayNames[v.bayIndex] ?? `Bay ${v.bayIndex + 1}`} · ` : ''}
                      {wayLabels[v.way]}
                    </p>
                    <p className="font-semibold text-ink">{verdictSentence(v, cable.metres)}</p>
                    <p className="text-sm text-ground-800">
                      {verdictDetail(v, slackMetres)}
                      {usual ? '' : ' You said you usually park the other way.'}
                    </p>
                  </div>
                </li>
              );
            })}
          </ul>
        )}
      </div>
      <p className="mt-3 text-sm text-ground-700">
        The cable is measured on the plan, round the car where it is in the way, plus {formatNumber(slackMetres, 2)} m so it hangs
        loose rather than pulled tight.
      </p>
    </section>
  );
}
