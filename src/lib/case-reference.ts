// Client-safe: case references people can read out on the phone (no 0/O or 1/I confusion).
const ALPHABET = 'ABCDEFGHJKMNPQRSTUVWXYZ23456789';

/**
 * A new random case reference.
 * @example newCaseReference() // 'GW-7KQ3PX'
 */
export function newCaseReference(random: () => number = Math.random): string {
  let s = '';
  for (let i = 0; i < 6; i++) s += ALPHABET[Math.floor(random() * ALPHABET.length)];
  return `GW-${s}`;
}
