// The stage of a case as a word in a pill (the React twin of stage-badge.astro).
import { stageLabels, type StageId } from '../../lib/stages';

const tone: Record<StageId, string> = {
  invited: 'bg-ground-50 text-ground-800 border-ground-200',
  filling_in: 'bg-ground-50 text-ground-800 border-ground-200',
  sent_for_review: 'bg-clay-50 text-clay-800 border-clay-200',
  in_review: 'bg-clay-50 text-clay-800 border-clay-200',
  ready_for_survey: 'bg-clear-soft text-clear border-clear/30',
  survey_booked: 'bg-clear-soft text-clear border-clear/30',
  surveyed: 'bg-ground-100 text-ground-900 border-ground-300',
  withdrawn: 'bg-white text-ground-600 border-ground-200',
};

export function StagePill({ stage }: { stage: StageId }) {
  return (
    <span className={`inline-block whitespace-nowrap rounded-full border px-2 py-0.5 text-sm font-semibold ${tone[stage]}`} data-stage={stage}>
      {stageLabels[stage]}
    </span>
  );
}
