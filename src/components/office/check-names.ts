// Short staff names for the readiness checks, found from the titles the queue lists as gaps.
// The titles come from their own small module, not the engine: the queue page stays light.
import { checkTitles } from '@/lib/readiness/check-titles';
import type { CheckId } from '@/lib/readiness/types';

export const checkShortNames: Record<CheckId, string> = {
  'supply-identity': 'MPAN',
  'supply-headroom': 'Supply headroom',
  'network-operator': 'Network operator',
  earthing: 'Earthing',
  'cable-run': 'Cable run',
  'cable-reach': 'Cable reach',
  parking: 'Parking',
  timing: 'Timing',
  documents: 'Documents',
};

const idByTitle = Object.fromEntries(Object.entries(checkTitles).map(([id, title]) => [title, id])) as Record<string, CheckId>;

/**
 * The short staff name for a check title, or the title itself when it is not known.
 * @example shortCheckName('Earthing for an outdoor charger') // 'Earthing'
 */
export function shortCheckName(title: string): string {
  const id = idByTitle[title];
  return id ? checkShortNames[id] : title;
}
