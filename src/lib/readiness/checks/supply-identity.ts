// Supply identity: the MPAN core is present, passes its check digit and names a region.
import { checkMpanCore, INDEPENDENT_NETWORK } from '@/lib/validation/mpan';
import type { CheckInput, CheckResult } from '@/lib/readiness/types';
import { checkTitles } from '../check-titles';

// The independent-network IDs 24–37 are from memory, not seen in the market operator's list: staff
// are told to confirm an unfamiliar ID against that published list instead.
const SOURCE =
  "The market operator's MPAN definition (Master Registration Agreement): check digit weights 3, 5, 7, 13, 17, 19, 23, 29, 31, 37, 41, 43, sum mod 11 mod 10; distributor IDs 10–23 the 14 GB distribution regions, 24 and above independent network operators (confirm an unfamiliar ID against the market operator's published list)";
const TITLE = checkTitles['supply-identity'];

/**
 * Missing is amber; a core that fails the check is red; a valid core is green with its region.
 *
 * @example checkSupplyIdentity({ answers: { supply: { mpanCore: '1312345678907' } }, uploads: [], settings: defaultReadinessSettings, today: '2025-01-01' }).figures.region
 * // 'Merseyside, Cheshire and North Wales'
 */
export function checkSupplyIdentity({ answers }: CheckInput): CheckResult {
  const entered = answers.supply?.mpanCore?.trim() ?? '';
  if (entered === '') return missingResult();
  const checked = checkMpanCore(entered);
  if (!checked.ok) {
    return {
      id: 'supply-identity',
      light: 'red',
      title: TITLE,
      customerText: checked.message,
      staffText: `MPAN core refused (${checked.reason}): "${entered}".`,
      figures: { mpanCore: entered, valid: false, reason: checked.reason, distributorId: null, region: null },
      source: SOURCE,
      actions: ['Check the 13-digit MPAN core against an electricity bill and correct it.'],
    };
  }
  const unlisted = checked.distributorStatus === 'unlisted';
  return {
    id: 'supply-identity',
    light: unlisted ? 'amber' : 'green',
    title: TITLE,
    customerText: unlisted
      ? 'Thank you — your supply number adds up, but it starts with a network number we do not recognise. The office will check it against your bill; nothing for you to do unless it was mistyped.'
      : `Thank you — your supply number checks out. ${whereText(checked.region)}`,
    staffText: unlisted
      ? `MPAN core ${checked.core} passes the check digit, but distributor ID ${checked.distributorId} is not among the independent-network IDs we know (24–37): confirm it against a bill and the market operator's published list.`
      : `MPAN core ${checked.core} valid (check digit); distributor ID ${checked.distributorId}: ${checked.region}.`,
    figures: {
      mpanCore: checked.core,
      valid: true,
      reason: unlisted ? 'unlisted-distributor' : null,
      distributorId: checked.distributorId,
      distributorStatus: checked.distributorStatus,
      region: unlisted ? null : checked.region,
    },
    source: SOURCE,
    actions: unlisted ? ['Confirm the distributor ID (first two digits of the MPAN core) against a bill.'] : [],
  };
}

function missingResult(): CheckResult {
  return {
    id: 'supply-identity',
    light: 'amber',
    title: TITLE,
    customerText:
      'We need the 13-digit MPAN core from your electricity bill: it identifies your supply and tells us which network area you are in.',
    staffText: 'MPAN core not given.',
    figures: { mpanCore: null, valid: null, reason: 'missing', distributorId: null, region: null },
    source: SOURCE,
    actions: ['Enter the 13-digit MPAN core from an electricity bill (the bottom line of the MPAN box).'],
  };
}

function whereText(region: string): string {
  if (region === INDEPENDENT_NETWORK) return 'Your home is on an independent network.';
  return `Your home is in the ${region} distribution region.`;
}
