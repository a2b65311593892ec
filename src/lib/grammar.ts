// Client-safe: articles and plurals for every sentence Groundwork builds around a count or a
// noun, so no page says "a order agreement" or "1 sections".

const pluralRules = new Intl.PluralRules('en-GB');

// Words that start with a vowel letter but a consonant sound ("a user", "a one-time link"), and
// the reverse ("an hour", "an MPAN": letters read by name). Common practice of English usage.
const CONSONANT_SOUND = /^(one\b|once\b|uni(?!n)|use|usu|eu|ewe|u[bcfhjkqrst][aeiou])/i;
const VOWEL_SOUND = /^(hour|honest|honour|heir)/i;
// Initialisms read letter by letter: "an MPAN", "an RCD", "a PDF", "a VIN".
const VOWEL_NAMED_LETTERS = /^[AEFHILMNORSX](?:[A-Z0-9]|$)/;

/**
 * "a" or "an" for the phrase that follows, by how its first word sounds.
 *
 * @example article('order agreement') // 'an'
 * @example article('MPAN') // 'an'
 * @example article('user') // 'a'
 * @example article('11 kW charge point') // 'an'
 */
export function article(phrase: string): 'a' | 'an' {
  const word = phrase.trim().replace(/^[“"'‘(]+/, '');
  const first = word.split(/[\s-]/)[0] ?? '';
  if (/^\d/.test(first)) return numberTakesAn(first) ? 'an' : 'a';
  if (first.length > 1 && first === first.toUpperCase() && /^[A-Z]/.test(first)) return VOWEL_NAMED_LETTERS.test(first) ? 'an' : 'a';
  if (VOWEL_SOUND.test(word)) return 'an';
  if (CONSONANT_SOUND.test(word)) return 'a';
  return /^[aeiou]/i.test(word) ? 'an' : 'a';
}

// Numbers by how they are read: "an 8 m cable", "an 11 kW charge point", "an 80 A fuse",
// "an 18 month", but "a 100 A fuse", "a 1.5 m gap".
function numberTakesAn(figure: string): boolean {
  const whole = figure.replace(/[,.].*$/, '');
  if (whole.startsWith('8')) return true;
  // 11 and 18 ("eleven", "eighteen"), and 11 or 18 thousand, million… read the same way.
  return /^1[18]$/.test(whole) || (/^1[18]\d+$/.test(whole) && (whole.length - 2) % 3 === 0);
}

/**
 * The phrase with its indefinite article.
 *
 * @example withArticle('admin account') // 'an admin account'
 */
export function withArticle(phrase: string): string {
  return `${article(phrase)} ${phrase}`;
}

/**
 * The singular or plural form for a count, chosen by Intl.PluralRules for British English.
 * `many` defaults to the singular plus "s".
 *
 * @example plural(1, 'section') // 'section'
 * @example plural(2, 'day') // 'days'
 * @example plural(3, 'reply', 'replies') // 'replies'
 */
export function plural(count: number, one: string, many = `${one}s`): string {
  return pluralRules.select(count) === 'one' ? one : many;
}

/**
 * A count and its noun: "1 section", "2 sections".
 *
 * @example countOf(1, 'section') // '1 section'
 * @example countOf(0, 'gap') // '0 gaps'
 * @example countOf(2, 'reply', 'replies') // '2 replies'
 */
export function countOf(count: number, one: string, many?: string): string {
  return `${count} ${plural(count, one, many)}`;
}

/**
 * Items joined as a sentence lists them: "a, b and c".
 *
 * @example listWords(['the meter', 'the cut-out', 'the consumer unit']) // 'the meter, the cut-out and the consumer unit'
 */
export function listWords(items: readonly string[], conjunction = 'and'): string {
  return new Intl.ListFormat('en-GB', { style: 'long', type: conjunction === 'or' ? 'disjunction' : 'conjunction' }).format(items);
}
