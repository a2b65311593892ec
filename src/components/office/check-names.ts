// Short staff names for the readiness checks, found from the titles the queue lists as gaps.
import { runChecks } from '@/lib/readiness';
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

// Each check's title is fixed, so running the engine once on nothing lists them all.
const idByTitle: Record<string, CheckId> = Object.fromEntries(runChecks({ today: '2025-01-01' }).checks.map((c) => [c.title, c.id]));

/**
 * The short staff name for a check title, or the title itself when it is not known.
 * @example shortCheckName('Earthing for an outdoor charger') // 'Earthing'
 */
export function shortCheckName(title: string): string {
  const id = idByTitle[title];
  return id ? checkShortNames[id] : title;
}
