// The stage of a case as a word in a pill (the React twin of stage-badge.astro).
import { stageLabels, stageTone, type StageId } from '@/lib/stages';

export function StagePill({ stage }: { stage: StageId }) {
  return (
    <span className={`inline-block whitespace-nowrap rounded-full border px-2 py-0.5 text-sm font-semibold ${stageTone[stage]}`} data-stage={stage}>
      {stageLabels[stage]}
    </span>
  );
}
