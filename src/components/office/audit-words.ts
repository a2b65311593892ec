// The audit trail in sentences: who did what, with each changed answer from → to.
import { uploadKindInfo, type UploadKind } from '@/lib/schemas/uploads';
import { stageLabels, type StageId } from '@/lib/stages';
import { countOf } from '@/lib/grammar';
import { auditValue, staffLabel } from '@/lib/vocabulary';
import type { AuditItem } from './case-types';
import { formatDay } from './format';

const roleWords: Record<string, string> = { customer: 'customer', admin: 'office', surveyor: 'surveyor' };

/** "Maren Oakes (customer)", or Groundwork itself for scheduled work. */
export function actorWords(item: Pick<AuditItem, 'actorId' | 'actorName' | 'actorRole'>): string {
  if (!item.actorId) return 'Groundwork (automatic)';
  const name = item.actorName ?? 'A former user';
  return item.actorRole ? `${name} (${roleWords[item.actorRole] ?? item.actorRole})` : name;
}

/**
 * A saved value as a short phrase: "—" for nothing, Yes/No, trimmed long text.
 * @example valueWords(null) // '—'
 */
export function valueWords(v: unknown, max = 80): string {
  if (v === null || v === undefined || v === '') return '—';
  if (typeof v === 'boolean') return v ? 'Yes' : 'No';
  if (typeof v === 'string') return v.length > max ? `${v.slice(0, max - 1)}…` : v;
  if (typeof v === 'number') return String(v);
  const json = JSON.stringify(v);
  return json.length > 60 ? 'a new drawing' : json;
}

const stageWord = (s: unknown) => (typeof s === 'string' && s in stageLabels ? stageLabels[s as StageId] : String(s ?? '—'));
const kindWord = (k: unknown) => (typeof k === 'string' && k in uploadKindInfo ? uploadKindInfo[k as UploadKind].title : 'a file');

export type AuditSentence = { text: string; details: string[] };

/**
 * What one audit entry says, given the upload kinds by id (review entries carry only the id).
 * @example describeAudit({ action: 'stage.changed', before: { stage: 'invited' }, after: { stage: 'filling_in' } } as AuditItem, {}).text
 * // 'moved the case from Invited to Filling in'
 */
export function describeAudit(item: AuditItem, uploadKindById: Record<string, UploadKind>, staffNames: Record<string, string> = {}): AuditSentence {
  const before = item.before ?? {};
  const after = item.after ?? {};
  const uploadKind = (item.entityId && uploadKindById[item.entityId]) || (after.kind as string | undefined) || (before.kind as string | undefined);
  switch (item.action) {
    case 'case.created':
      return { text: 'opened the case and invited the customer', details: after.note ? [`Note in the invitation: “${valueWords(after.note, 1000)}”`] : [] };
    case 'checklist.updated': {
      const keys = Object.keys(after).length ? Object.keys(after) : Object.keys(before);
      const changes = keys.map((k) => `${staffLabel(k)} from ${auditValue(k, before[k])} to ${auditValue(k, after[k])}`);
      if (changes.length === 1) return { text: `changed ${changes[0]}`, details: [] };
      return { text: `changed ${countOf(changes.length, 'answer')}`, details: changes };
    }
    case 'checklist.confirmed':
      return { text: 'confirmed the details the office filled in from the invitation', details: [] };
    case 'stage.changed': {
      const details: string[] = [];
      if (after.overrideReason) details.push(`Override of red checks: “${valueWords(after.overrideReason, 1000)}”`);
      if (after.surveyDate) {
        const who = typeof after.surveyorId === 'string' ? staffNames[after.surveyorId] : undefined;
        details.push(`Survey on ${formatDay(String(after.surveyDate))}${who ? ` with ${who}` : ''}`);
      }
      if (typeof after.gaps === 'number' && after.gaps > 0) details.push(`Sent with ${countOf(after.gaps, 'unanswered field')} acknowledged`);
      return { text: `moved the case from ${stageWord(before.stage)} to ${stageWord(after.stage)}`, details };
    }
    case 'upload.added':
      return { text: `uploaded ${kindWord(uploadKind)}`, details: after.originalName ? [String(after.originalName)] : [] };
    case 'upload.accepted':
      return { text: `accepted ${kindWord(uploadKind)}`, details: [] };
    case 'upload.rejected':
      return { text: `rejected ${kindWord(uploadKind)}`, details: after.reason ? [`Reason: “${valueWords(after.reason, 1000)}”`] : [] };
    case 'upload.deleted':
    case 'upload.discarded':
      return { text: `removed ${kindWord(uploadKind)}`, details: [] };
    case 'note.added':
      return { text: 'added a note', details: [] };
    case 'site_measures.recorded': {
      const words: Record<string, string> = {
        measuredMaxDemandAmps: 'Measured maximum demand (A)',
        earthingMeasure: '722.411.4.1 measure',
        electrodeOhms: 'Electrode RA (Ω)',
        rcdIdnMilliamps: 'RCD IΔn (mA)',
      };
      const keys = [...new Set([...Object.keys(before), ...Object.keys(after)])].filter((k) => JSON.stringify(before[k]) !== JSON.stringify(after[k]));
      return { text: 'recorded site measures', details: keys.map((k) => `${words[k] ?? k}: ${valueWords(before[k])} to ${valueWords(after[k])}`) };
    }
    case 'case.chased':
    case 'case.reminded': {
      const items = Array.isArray(after.items) ? (after.items as string[]) : [];
      const what = item.action === 'case.chased' ? 'chased the customer by e-mail' : 'sent an automatic reminder';
      return { text: `${what} for ${countOf(items.length, 'item')}`, details: items };
    }
    default:
      return { text: item.action.replace(/[._]/g, ' '), details: [] };
  }
}
