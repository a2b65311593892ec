// Client-safe: what a customer still has to do, in plain words — the list chasers e-mail and
// the checklist shows. Built from the same rules as the readiness checks.
import { sectionProgress, type Checklist } from './schemas/checklist';
import { article, listWords } from './grammar';
import { customerGapLabel } from './vocabulary/fields';
import { endSentence, quoted } from './punctuation';
import { requiredUploadKinds } from './readiness/checks/documents';
import { uploadKindLabels, uploadKindStatus } from './readiness/upload-status';
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
    const status = uploadKindStatus(kind, uploads);
    if (status.state === 'missing') gaps.push({ section: 'uploads', title: 'Photos and documents', text: `Upload ${article(uploadKindLabels[kind])} ${uploadKindLabels[kind]}.` });
    if (status.state === 'rejected') {
      gaps.push({
        section: 'uploads',
        title: 'Photos and documents',
        text: endSentence(`Send a new ${uploadKindLabels[kind]}${status.reason ? ` — your installer said: ${quoted(status.reason)}` : ''}`),
      });
    }
  }
  return gaps;
}
