// Client-safe: ending sentences that are built from pieces (a quoted reason, a free-text note)
// without doubling the full stop the piece already has: “Too dark.” not “Too dark.”.

const ENDED = /[.!?…][”"’')\]]*$/;

/**
 * The text with one full stop at its end, unless it already ends a sentence (also inside a
 * closing quote or bracket). Trailing spaces are dropped; an empty text stays empty.
 *
 * @example endSentence('Too dark') // 'Too dark.'
 * @example endSentence('your installer said: “Too dark.”') // 'your installer said: “Too dark.”'
 */
export function endSentence(text: string): string {
  const trimmed = text.trimEnd();
  if (trimmed === '' || ENDED.test(trimmed)) return trimmed;
  return `${trimmed}.`;
}

/**
 * Someone's words in curly quotes, trimmed, for the middle or end of a sentence.
 *
 * @example quoted(' Too dark. ') // '“Too dark.”'
 */
export function quoted(text: string): string {
  return `“${text.trim()}”`;
}
