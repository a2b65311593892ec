// What a vehicle record's fuel type means for a home charge point, in the customer's words.
// Pure and client-safe. The fuel type words are those of the government vehicle enquiry
// service's records (from memory of its public API documentation: ELECTRICITY, PETROL, DIESEL,
// HYBRID ELECTRIC, ELECTRIC DIESEL, GAS BI-FUEL, …).
import { withArticle } from './grammar';

export type FuelFit = 'electric' | 'hybrid' | 'not-electric' | 'unknown';

/**
 * Sorts a recorded fuel type: battery electric, some kind of hybrid (the record does not say
 * whether it plugs in), or a car that cannot charge from a charge point.
 *
 * @example fuelFit('ELECTRICITY') // 'electric'
 */
export function fuelFit(fuelType: string | null | undefined): FuelFit {
  const f = (fuelType ?? '').trim().toUpperCase();
  if (f === '') return 'unknown';
  if (f === 'ELECTRICITY' || f === 'ELECTRIC') return 'electric';
  if (f.includes('ELECTRIC') || f.includes('HYBRID')) return 'hybrid';
  return 'not-electric';
}

/** A fuel type as it reads in a sentence. @example fuelWords('HYBRID ELECTRIC') // 'hybrid electric' */
export function fuelWords(fuelType: string): string {
  const f = fuelType.trim().toUpperCase();
  return f === 'ELECTRICITY' ? 'electric' : f.toLowerCase();
}

/**
 * The words to show when the record does not look like a car that charges from a charge point,
 * or null when it does.
 *
 * @example fuelAdvice('PETROL', 'AB12 CDE') // 'Is this the right car? The records for AB12 CDE say it runs on petrol. …'
 */
export function fuelAdvice(fuelType: string | null | undefined, registration: string): string | null {
  const fit = fuelFit(fuelType);
  if (fit === 'electric') return null;
  if (fit === 'hybrid') {
    return `The records for ${registration} say it is ${withArticle(`${fuelWords(fuelType!)} car`)}. Only plug-in hybrids can use a charge point, so if yours has no charging socket, please check the number plate. Is this the right car?`;
  }
  if (fit === 'unknown') return `The records for ${registration} do not say what fuel it uses. Is this the right car?`;
  return `Is this the right car? The records for ${registration} say it runs on ${fuelWords(fuelType!)}, and a charge point is for electric and plug-in hybrid cars. Please check the number plate, or carry on if this is a car you are replacing.`;
}

/** A maker's name as records write it (capitals), for reading. @example makeWords('LARKSPUR MOTORS') // 'Larkspur Motors' */
export function makeWords(make: string): string {
  return make
    .trim()
    .toLowerCase()
    .replace(/(^|[\s-])(\p{L})/gu, (_, sep: string, ch: string) => sep + ch.toUpperCase());
}
