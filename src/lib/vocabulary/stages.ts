// Client-safe: the words for each stage of a case — the office's name, and what the customer
// reads instead (one short state and one line of what happens next, never the same words twice).
import type { StageId } from '@/lib/stages';

/** The office's name for each stage. */
export const stageLabels: Record<StageId, string> = {
  invited: 'Invited',
  filling_in: 'Filling in',
  sent_for_review: 'Sent for review',
  in_review: 'In review',
  ready_for_survey: 'Ready for survey',
  survey_booked: 'Survey booked',
  surveyed: 'Surveyed',
  withdrawn: 'Withdrawn',
};

/**
 * What the customer reads about where their case is: a short state and what happens next. A
 * withdrawn case reads "Closed" to the customer, and the office's word never appears beside it.
 */
export const customerStage: Record<StageId, { label: string; next: string }> = {
  invited: { label: 'Not started yet', next: 'Start whenever you’re ready: your answers save as you go.' },
  filling_in: { label: 'In progress', next: 'Carry on whenever you’re ready.' },
  sent_for_review: { label: 'Sent to your installer', next: 'Nothing more to do for now, unless something changes.' },
  in_review: { label: 'Being looked at', next: 'Your installer’s office is going through your answers.' },
  ready_for_survey: { label: 'Ready for the survey', next: 'Your installer will be in touch to book a visit.' },
  survey_booked: { label: 'Survey booked', next: 'Your installer will visit on the date they sent you.' },
  surveyed: { label: 'Survey done', next: 'Your installer will be in touch about fitting.' },
  withdrawn: { label: 'Closed', next: 'If you weren’t expecting this, please get in touch with your installer.' },
};
