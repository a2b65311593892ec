// Client-safe: every safety caution a customer, the office or a surveyor reads, in one place.
// The photo step and slots, the "Photos and documents" page, the chase, reminder, rejection and
// invitation e-mails, the readiness view and the surveyor's pack all read these words from here.
import type { UploadKind } from './readiness/types';

/** Each caution once, in plain words for the customer. */
export const caution = Object.freeze({
  /** Word for word what the pack has always printed; keep it so. */
  photosOnly: 'Never open the cut-out, the meter or the consumer unit, or remove covers: photos only.',
  consumerUnitClosed: 'There is no need to open the consumer unit (fuse box): a photo with its cover closed is just what we need.',
  meterCupboard: 'Opening the meter cupboard door to look and take photos is fine; don’t touch anything inside it.',
  applianceRating: 'Never take the cover off an appliance to read its rating: look in its manual or on the label on the outside.',
  // 105 reaches the local electricity network operator in England, Scotland and Wales, free from
  // most phones (ENA, "Power Cut? Call 105", launched 2016). Northern Ireland has its own number.
  danger:
    'If you see damage, scorching or exposed wires, or smell burning, keep away and call 105, the free power-cut and emergency number for the electricity network in Great Britain. If there is a fire or someone is hurt, call 999.',
  /** For staff and the pack. */
  mainFuse: 'Only the network operator (or its agent) may change the main fuse or the cut-out.',
  /** The same, in the customer's words. */
  mainFuseCustomer: 'Only your network operator, or someone working for them, may change the main fuse or the cut-out.',
  notADesign:
    'These checks help prepare for the survey; they are not a design. The installation is designed, installed and certified by a qualified electrician under BS 7671, the IET Code of Practice for EV Charging Equipment Installation, and local building and planning rules.',
});

/**
 * What a customer reads wherever photos are asked for, and in every e-mail that asks for them.
 *
 * @example customerPhotoCautions[0] // 'Never open the cut-out, the meter or the consumer unit, or remove covers: photos only.'
 */
export const customerPhotoCautions: readonly string[] = Object.freeze([
  caution.photosOnly,
  caution.consumerUnitClosed,
  caution.meterCupboard,
  caution.applianceRating,
  caution.danger,
]);

/**
 * The one-line caution under a photo slot, for the kinds where a customer could be tempted to
 * open something; null for the rest.
 *
 * @example slotCaution('consumer_unit_photo') // 'A photo of the consumer unit (fuse box) with its cover closed …'
 */
export function slotCaution(kind: UploadKind): string | null {
  if (kind === 'consumer_unit_photo') return caution.consumerUnitClosed;
  if (kind === 'meter_photo' || kind === 'cutout_photo') return caution.meterCupboard;
  return null;
}

/**
 * Beside the readiness results, for the customer and the pack.
 *
 * @example readinessCautions.length // 4
 */
export const readinessCautions: readonly string[] = Object.freeze([caution.photosOnly, caution.danger, caution.mainFuse, caution.notADesign]);

export const COMMON_PRACTICE_CAUTION = 'Common practice — no published source';

/**
 * Every caution in the surveyor's pack with the published document it rests on (or "common
 * practice" for plain safety advice no standard words for a householder).
 *
 * @example packCautions.find((c) => c.text === caution.danger)?.source // 'Energy Networks Association, "Power Cut? Call 105" …'
 */
export const packCautions: readonly { text: string; source: string }[] = Object.freeze([
  { text: caution.photosOnly, source: COMMON_PRACTICE_CAUTION },
  { text: caution.meterCupboard, source: COMMON_PRACTICE_CAUTION },
  { text: caution.applianceRating, source: COMMON_PRACTICE_CAUTION },
  { text: caution.danger, source: 'Energy Networks Association, "Power Cut? Call 105" (the electricity network operators’ national number, England, Scotland and Wales)' },
  {
    text: caution.mainFuse,
    source: 'Energy Networks Association, "Connecting electric vehicles and heat pumps" (the cut-out and its fuse are the network operator’s equipment)',
  },
  { text: caution.notADesign, source: 'BS 7671:2018+A2:2022; IET Code of Practice for EV Charging Equipment Installation' },
  {
    text: 'PME and an outdoor charging point: a PME earthing facility is not to be used unless one of the listed measures applies (an installation earth electrode, or a device that disconnects live and protective conductors on a broken PEN). Check the current amendment. The earthing check stays amber until the measure is recorded; open soil only says whether an electrode is practical.',
    source: 'BS 7671:2018+A2:2022 Regulation 722.411.4.1',
  },
  {
    text: 'Each charging point needs its own 30 mA RCD of at least Type A; Type B, or Type A/F with an RDC-DD to BS IEC 62955, where DC fault current over 6 mA is possible.',
    source: 'BS 7671:2018+A2:2022 Regulation 722.531.3.101',
  },
]);
