// Articles and plurals. Plural categories are CLDR's for English, as Intl.PluralRules reports them
// (Unicode CLDR plural rules, "en": one = i is 1 and v is 0; other = everything else). The a/an
// choice follows the sound of the next word, as English usage guides put it (e.g. "an hour",
// "a user", "an MPAN"); the lists below are worked by reading each word aloud.
import { describe, expect, it } from 'vitest';
import { article, countOf, listWords, plural, withArticle } from '@/lib/grammar';

describe('article', () => {
  it.each([
    ['order agreement', 'an'],
    ['admin account', 'an'],
    ['surveyor account', 'a'],
    ['electric car', 'an'],
    ['hybrid car', 'a'],
    ['hour', 'an'],
    ['user', 'a'],
    ['one-time link', 'a'],
    ['unusual plate', 'an'],
    ['MPAN', 'an'], // "em-pan", read as letters
    ['RCD', 'an'],
    ['PDF', 'a'],
    ['VIN', 'a'],
    ['8 m tethered cable', 'an'],
    ['11 kW charge point', 'an'],
    ['18 kW heat pump', 'an'],
    ['80 A main fuse', 'an'],
    ['60 A main fuse', 'a'],
    ['100 A main fuse', 'a'],
    ['5 m tethered cable', 'a'],
    ['photo of your electricity meter', 'a'],
  ])('“%s” takes “%s”', (phrase, expected) => {
    expect(article(phrase)).toBe(expected);
  });

  it('puts the article before the phrase', () => {
    expect(withArticle('order agreement for the car')).toBe('an order agreement for the car');
  });
});

describe('plural and countOf (CLDR English categories through Intl.PluralRules)', () => {
  it.each([
    [0, '0 sections'],
    [1, '1 section'],
    [2, '2 sections'],
    [1.5, '1.5 sections'],
  ])('%s → %s', (n, expected) => {
    expect(countOf(n, 'section')).toBe(expected);
  });

  it('takes an irregular plural', () => {
    expect(plural(2, 'reply', 'replies')).toBe('replies');
    expect(countOf(1, 'reply', 'replies')).toBe('1 reply');
  });

  it('joins lists the British way, with no serial comma', () => {
    expect(listWords(['the meter', 'the cut-out', 'the consumer unit'])).toBe('the meter, the cut-out and the consumer unit');
    expect(listWords(['nose in', 'reversing in'], 'or')).toBe('nose in or reversing in');
  });
});
