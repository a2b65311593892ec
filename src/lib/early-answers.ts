// Answers typed before the checklist's script has run. The server draws the step with every
// field in it, so on a slow phone the customer can start typing at first paint, seconds before
// the island hydrates. A few lines in the page (EARLY_ANSWER_RECORDER, inlined before any
// script is fetched) note the last value of each named field inside `[data-early-answers]`;
// when the island hydrates it takes them once, puts them back into its form and saves them like
// any other edit. Nothing is lost either way: without this, hydration would reset the fields to
// the answers the page was drawn with.

/** Where the recorder keeps what it noted (a property of `window`). */
export const EARLY_ANSWERS_KEY = '__groundworkEarlyAnswers';

/**
 * The attribute marking an element whose fields keep what is entered before hydration: the
 * checklist's root (through the recorder below) and the photo slots (a chosen file waits in its
 * input and the slot sends it on hydration). Each has a browser test; `npm run bench:pages`
 * counts such a field as ready from first paint.
 */
export const EARLY_ANSWERS_ATTR = 'data-early-answers';

export type EarlyAnswers = { answers: Record<string, string>; taken: boolean };

/**
 * The recorder, as the source of an inline script. Plain ES5-level JavaScript so that it runs as
 * written on any phone. Text boxes, text areas and lists keep their value, a radio button its
 * value when chosen; tick boxes and files are left to the island (their state lives there).
 */
export const EARLY_ANSWER_RECORDER = `(function () {
  var store = { answers: {}, taken: false };
  window[${JSON.stringify(EARLY_ANSWERS_KEY)}] = store;
  function note(e) {
    var el = e.target;
    if (store.taken || !el || !el.name || !el.closest || !el.closest('[${EARLY_ANSWERS_ATTR}]')) return;
    if (el.type === 'radio') { if (el.checked) store.answers[el.name] = el.value; }
    else if (el.type !== 'checkbox' && el.type !== 'file') store.answers[el.name] = el.value;
  }
  document.addEventListener('input', note, true);
  document.addEventListener('change', note, true);
})();`;

/**
 * The answers typed before hydration, handed over once (later calls get none, and the recorder
 * stops noting: from now on the island's own handlers see every change).
 * @example for (const [path, value] of Object.entries(takeEarlyAnswers())) form.setValue(path, value);
 */
export function takeEarlyAnswers(): Record<string, string> {
  if (typeof window === 'undefined') return {};
  const store = (window as unknown as Record<string, EarlyAnswers | undefined>)[EARLY_ANSWERS_KEY];
  if (!store || store.taken) return {};
  store.taken = true;
  return { ...store.answers };
}
