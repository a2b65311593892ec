// Client-safe: what the customer's home page says is done and what is still needed, each thing
// still needed with the checklist step that takes care of it. Built from the same step progress
// and required uploads as the checklist, so the two never disagree.
import type { Checklist } from './schemas/checklist';
import type { UploadKind } from './schemas/uploads';
import { listWords } from './grammar';
import { uploadNeed } from './gaps';
import { endSentence } from './punctuation';
import { customerGapLabel } from './vocabulary/fields';
import { requiredUploadKinds } from './readiness/checks/documents';
import { uploadKindStatus } from './readiness/upload-status';
import type { ChecklistAnswers, UploadSummary } from './readiness/types';
import { checklistSteps, stepProgress, stepTitle, type StepId } from './checklist-steps';

type PlaceStep = Exclude<StepId, 'review'>;

/** The step whose page holds each upload slot. */
export const uploadStep: Readonly<Record<Exclude<UploadKind, 'other'>, PlaceStep>> = {
  meter_photo: 'supplyphotos',
  cutout_photo: 'supplyphotos',
  consumer_unit_photo: 'supplyphotos',
  landlord_permission: 'home',
  order_agreement: 'vehicle',
  parking_evidence: 'parking',
  charger_location_photo: 'charger',
};

export type NextThing = { step: PlaceStep; stepTitle: string; text: string };
export type CustomerNext = { done: { step: PlaceStep; title: string }[]; needed: NextThing[] };

const sentence = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);

/**
 * Done steps, and each thing still needed in the order the checklist asks for it: answers to
 * give, details from the installer to check, photos and documents to send (or send again).
 *
 * @example customerNext({}, [], []).needed[0] // { step: 'about', stepTitle: 'About you', text: 'Add your name, …' }
 */
export function customerNext(checklist: Checklist, prefilled: readonly string[], uploads: readonly UploadSummary[]): CustomerNext {
  const progress = stepProgress(checklist, prefilled);
  const needed: NextThing[] = [];
  const uploadsByStep = new Map<PlaceStep, NextThing[]>();
  for (const kind of requiredUploadKinds(checklist as ChecklistAnswers)) {
    const status = uploadKindStatus(kind, uploads);
    if (kind === 'other') continue;
    const step = uploadStep[kind];
    const title = stepTitle(step);
    const text = uploadNeed(status, 'Send');
    if (text) uploadsByStep.set(step, [...(uploadsByStep.get(step) ?? []), { step, stepTitle: title, text }]);
  }
  for (const { id } of checklistSteps) {
    const p = progress.find((s) => s.id === id);
    if (p) {
      const toAnswer = p.missing.filter((path) => !p.toConfirm.includes(path));
      if (p.toConfirm.length > 0) needed.push({ step: p.id, stepTitle: p.title, text: 'Check the details your installer filled in, and confirm them.' });
      if (toAnswer.length > 0) {
        // One phrase covers all the load questions, so say each phrase once.
        const words = [...new Set(toAnswer.map((path) => customerGapLabel(path)))];
        needed.push({ step: p.id, stepTitle: p.title, text: endSentence(sentence(`add ${listWords(words)}`)) });
      }
    }
    if (id !== 'review') needed.push(...(uploadsByStep.get(id) ?? []));
  }
  const done = progress.filter((p) => p.complete && !(uploadsByStep.get(p.id)?.length)).map((p) => ({ step: p.id, title: p.title }));
  return { done, needed };
}
