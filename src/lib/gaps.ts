// Client-safe: what a customer still has to do, in plain words — the list chasers e-mail and
// the checklist shows. Built from the same rules as the readiness checks.
import { sectionProgress, type Checklist } from './schemas/checklist';
import { article, listWords } from './grammar';
import { customerGapLabel } from './vocabulary/fields';
import { endSentence, quoted } from './punctuation';
import { requiredUploadKinds } from './readiness/checks/documents';
import { uploadKindLabels, uploadKindStatus, type UploadKindStatus } from './readiness/upload-status';
import type { ChecklistAnswers, UploadSummary } from './readiness/types';


export type CustomerGap = { section: string; title: string; text: string };

/**
 * Every missing answer, missing upload and rejected upload, each as one plain sentence.
 * @example customerGaps({}, [])[0] // { section: 'about', title: 'About you', text: 'Tell us your name.' }
 */
export function customerGaps(checklist: Checklist, uploads: readonly UploadSummary[]): CustomerGap[] {
  const gaps: CustomerGap[] = [];
  for (const s of sectionProgress(checklist)) {
    if (s.missing.length === 0) continue;
    // Several load questions share one label: name each missing thing once, as a list is read.
    const fields = [...new Set(s.missing.map((f) => customerGapLabel(`${s.id}.${f}`)))];
    gaps.push({ section: s.id, title: s.title, text: endSentence(`${s.title}: add ${listWords(fields)}`) });
  }
  for (const kind of requiredUploadKinds(checklist as ChecklistAnswers)) {
    const text = uploadNeed(uploadKindStatus(kind, uploads), 'Upload');
    if (text) gaps.push({ section: 'uploads', title: 'Photos and documents', text });
  }
  return gaps;
}

/**
 * One required upload as a sentence for the customer, or null when it is in: "Upload a …" (or
 * "Send a …", as `missingVerb` says) when missing, "Send a new …" with the office's reason when
 * rejected.
 * @example uploadNeed({ kind: 'meter_photo', state: 'missing' }, 'Send') // 'Send a photo of your electricity meter.'
 */
export function uploadNeed(status: UploadKindStatus, missingVerb: 'Upload' | 'Send'): string | null {
  const label = uploadKindLabels[status.kind];
  if (status.state === 'missing') return `${missingVerb} ${article(label)} ${label}.`;
  if (status.state === 'rejected') return endSentence(`Send a new ${label}${status.reason ? ` — your installer said: ${quoted(status.reason)}` : ''}`);
  return null;
}
