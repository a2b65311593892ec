// Client-safe: a saved answer in words, for staff (the case page, the pack, the PDF, the audit
// trail). Choices read their staff words from the field vocabulary; a value that is not a known
// option is spelled out, so a raw id such as "side-left" never reaches a page.
import { optionWords, wordsFor } from './fields';

const kwOrNone = (n: number, suffix = '') => (n === 0 ? 'None' : `${n} kW${suffix}`);
const numberWords: Record<string, (n: number) => string> = {
  'supply.mainFuseAmps': (n) => `${n} A`,
  'supply.loads.showerKw': (n) => kwOrNone(n),
  'supply.loads.heatPumpKw': (n) => kwOrNone(n),
  'supply.loads.storageHeaters': (n) => kwOrNone(n, ' in total'),
  'charger.cableRunMetres': (n) => `${n} m`,
  'charger.softGroundMetres': (n) => `${n} m`,
  'charger.tetherMetres': (n) => `${n} m`,
  'charger.ratingKw': (n) => `${n} kW`,
};

const dateFormat = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });

/**
 * A code that is not a known option, as words: "attached-drive" → "Attached drive".
 *
 * @example spellCode('reverse-in') // 'Reverse in'
 */
export function spellCode(value: string): string {
  if (!/^[a-z][a-z0-9]*([-_][a-z0-9]+)*$/.test(value)) return value;
  const words = value.replace(/[-_]/g, ' ');
  return words.charAt(0).toUpperCase() + words.slice(1);
}

/**
 * An answer in staff words, or null when it was not given. A saved null main fuse means the
 * customer could not read it.
 *
 * @example staffAnswer('supply.mainFuseAmps', null, true) // 'Could not read it'
 * @example staffAnswer('vehicle.chargePort', 'side-left', true) // 'Left side, rear'
 */
export function staffAnswer(path: string, value: unknown, present: boolean): string | null {
  if (path === 'supply.mainFuseAmps' && present && value === null) return optionWords(path, 'unreadable', 'staff');
  if (value === undefined || value === null || value === '') return null;
  if (typeof value === 'boolean') return value ? 'Yes' : 'No';
  if (typeof value === 'number') return numberWords[path]?.(value) ?? optionWords(path, value, 'staff') ?? String(value);
  if (typeof value === 'string') {
    if (path === 'vehicle.deliveryDate' && /^\d{4}-\d{2}-\d{2}$/.test(value)) return dateFormat.format(new Date(`${value}T00:00:00Z`));
    // A choice field's unknown value is a code: spell it out rather than show it raw.
    return optionWords(path, value, 'staff') ?? (wordsFor(path)?.options ? spellCode(value) : value);
  }
  if (path === 'charger.plan') return 'Drawn (see cable reach)';
  return JSON.stringify(value);
}

/**
 * A saved value as a short staff phrase for the audit trail: "—" for nothing, choices in staff
 * words, long text trimmed.
 *
 * @example auditValue('parking.habit', 'reverse-in') // 'Reversing in'
 */
export function auditValue(path: string, value: unknown, max = 80): string {
  if (value === null || value === undefined || value === '') return '—';
  if (path === 'charger.plan' || (typeof value === 'object' && value !== null)) {
    const json = JSON.stringify(value);
    return json.length > 60 || path === 'charger.plan' ? 'a new drawing' : json;
  }
  const words = staffAnswer(path, value, true) ?? String(value);
  return words.length > max ? `${words.slice(0, max - 1)}…` : words;
}
