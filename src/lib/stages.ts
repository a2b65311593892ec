// Client-safe: the stages a case moves through, their words, and the moves allowed.
export const stages = [
  'invited',
  'filling_in',
  'sent_for_review',
  'in_review',
  'ready_for_survey',
  'survey_booked',
  'surveyed',
  'withdrawn',
] as const;
export type StageId = (typeof stages)[number];

// The words live in the vocabulary; re-exported so existing callers keep one import.
export { customerStage, stageLabels } from './vocabulary/stages';

const forward: Record<StageId, StageId[]> = {
  invited: ['filling_in'],
  filling_in: ['sent_for_review'],
  sent_for_review: ['in_review'],
  in_review: ['ready_for_survey'],
  ready_for_survey: ['survey_booked'],
  survey_booked: ['surveyed'],
  surveyed: [],
  withdrawn: [],
};

export const openStages: StageId[] = stages.filter((s) => s !== 'surveyed' && s !== 'withdrawn');

/**
 * The stages a case may move to from `from`: the next one, or Withdrawn from any open stage.
 * @example allowedMoves('in_review') // ['ready_for_survey', 'withdrawn']
 */
export function allowedMoves(from: StageId): StageId[] {
  const next = [...forward[from]];
  if (openStages.includes(from)) next.push('withdrawn');
  return next;
}

/** Tailwind classes for each stage's pill, shared by the Astro badge and the React pill. */
export const stageTone: Record<StageId, string> = {
  invited: 'bg-ground-50 text-ground-800 border-ground-200',
  filling_in: 'bg-ground-50 text-ground-800 border-ground-200',
  sent_for_review: 'bg-clay-50 text-clay-800 border-clay-200',
  in_review: 'bg-clay-50 text-clay-800 border-clay-200',
  ready_for_survey: 'bg-clear-soft text-clear border-clear/30',
  survey_booked: 'bg-clear-soft text-clear border-clear/30',
  surveyed: 'bg-ground-100 text-ground-900 border-ground-300',
  withdrawn: 'bg-white text-ground-600 border-ground-200',
};
