// Server-only: Groundwork's e-mails, each sent as HTML and as plain text carrying the same words,
// in one voice. Every template lives here so one test can render them all.
import { customerPhotoCautions } from '@/lib/cautions';
import { countOf } from '@/lib/grammar';
import { endSentence, quoted } from '@/lib/punctuation';
import { staffLabel } from '@/lib/vocabulary/fields';

const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

export type Block = { kind: 'p'; text: string } | { kind: 'button'; text: string; href: string } | { kind: 'list'; items: readonly string[] };

/** Who reads it: a customer's e-mail speaks for their installer; a staff e-mail does not. */
export type Audience = 'customer' | 'staff';

const FOOTER: Record<Audience, string> = {
  customer: 'Groundwork, on behalf of your installer. If you weren’t expecting this e-mail, you can ignore it.',
  staff: 'Sent by Groundwork to your firm’s staff. If you weren’t expecting this e-mail, you can ignore it.',
};
const BRAND = 'Groundwork';

/** The safety cautions every e-mail that asks for photos carries (src/lib/cautions.ts). */
const safetyBlocks: Block[] = [
  { kind: 'p', text: 'Staying safe while you take photos:' },
  { kind: 'list', items: customerPhotoCautions },
];

/**
 * Lays out an e-mail from blocks, so every message looks and reads the same: the plain-text part
 * and the HTML part carry the same words in the same order (the HTML adds only styling, and
 * the text part spells out each button's link after its words).
 *
 * @example renderEmail('Hello', [{ kind: 'p', text: 'Hi.' }]).text.startsWith('Groundwork\n\nHello') // true
 */
export function renderEmail(title: string, blocks: Block[], audience: Audience = 'customer'): { text: string; html: string } {
  const text = [
    BRAND,
    title,
    ...blocks.map((b) =>
      b.kind === 'p' ? b.text : b.kind === 'button' ? `${b.text}: ${b.href}` : b.items.map((i) => `  - ${i}`).join('\n'),
    ),
    FOOTER[audience],
  ].join('\n\n');
  const body = blocks
    .map((b) => {
      if (b.kind === 'p') return `<p style="margin:0 0 16px;line-height:1.5">${escapeHtml(b.text)}</p>`;
      if (b.kind === 'list')
        return `<ul style="margin:0 0 16px;padding-left:20px;line-height:1.5">${b.items.map((i) => `<li>${escapeHtml(i)}</li>`).join('')}</ul>`;
      return `<p style="margin:24px 0"><a href="${escapeHtml(b.href)}" style="background:#34635d;color:#fff;padding:12px 20px;border-radius:6px;text-decoration:none;font-weight:600;display:inline-block">${escapeHtml(b.text)}</a></p>`;
    })
    .join('\n');
  const html = `<!doctype html><html lang="en-GB"><head><meta charset="utf-8"><title>${escapeHtml(title)}</title></head><body style="margin:0;background:#fbfaf7;font-family:'Source Sans 3',Arial,sans-serif;color:#1d2524">
<div style="max-width:560px;margin:0 auto;padding:24px">
<div style="font-weight:700;font-size:18px;color:#2b504c;margin-bottom:16px">${BRAND}</div>
<h1 style="font-size:22px;margin:0 0 16px">${escapeHtml(title)}</h1>
${body}
<p style="margin:32px 0 0;font-size:13px;color:#5b6664">${escapeHtml(FOOTER[audience])}</p>
</div></body></html>`;
  return { text, html };
}

/** "a new photo of your meter", but "your landlord's permission" (no article before "your"/"the"). */
function aNew(what: string): string {
  return /^(your|the)\b/i.test(what) ? what : `a new ${what}`;
}

const firstName = (name: string) => name.trim().split(/\s+/)[0] || 'there';

export function signInLinkEmail(url: string): { subject: string; text: string; html: string } {
  return {
    subject: 'Your Groundwork sign-in link',
    ...renderEmail('Sign in to Groundwork', [
      { kind: 'p', text: 'Use the button below to sign in and carry on getting your home ready for its charge point.' },
      { kind: 'button', text: 'Sign in to Groundwork', href: url },
      { kind: 'p', text: 'The link works once and expires in 24 hours. If it has expired, ask for a new one on the sign-in page.' },
    ]),
  };
}

export function caseSubmittedEmail(input: { reference: string; customer: string; address: string; gaps: { section: string; title: string; missing: string[] }[]; url: string }) {
  const gapLines = input.gaps.map((g) => `${g.title}: ${[...new Set(g.missing.map((f) => staffLabel(`${g.section}.${f}`)))].join(', ')}`);
  return {
    subject: `Case ${input.reference} sent for review${input.gaps.length ? ` (${countOf(input.gaps.length, 'section')} with gaps)` : ''}`,
    ...renderEmail(`${input.customer} has sent their case for review`, [
      { kind: 'p', text: `Case ${input.reference}, ${input.address || 'address not given yet'}.` },
      ...(gapLines.length
        ? [{ kind: 'p' as const, text: 'They sent it with these gaps:' }, { kind: 'list' as const, items: gapLines }]
        : [{ kind: 'p' as const, text: 'Every section of the checklist is complete.' }]),
      { kind: 'button', text: 'Open the case', href: input.url },
    ], 'staff'),
  };
}

export function invitationEmail(input: { customerName: string; firmName: string; url: string; note?: string }) {
  return {
    subject: `${input.firmName}: let’s get your home ready for its charge point`,
    ...renderEmail(`Hello ${firstName(input.customerName)}, let’s get your home ready`, [
      {
        kind: 'p',
        text:
          `${input.firmName} uses Groundwork to collect what they need before your charge point survey. ` +
          'You’ll be asked about you and your home, your car and when it arrives, your electricity supply (the MPAN from a bill, ' +
          'and photos of your meter, main fuse and consumer unit), where the car parks, and where ' +
          'you’d like the charge point. It saves as you go, so you can do it in several sittings, on your phone or a computer.',
      },
      ...(input.note ? [{ kind: 'p' as const, text: endSentence(`A note from ${input.firmName}: ${input.note}`) }] : []),
      { kind: 'button', text: 'Start my checklist', href: input.url },
      { kind: 'p', text: 'This link signs you in once and lasts 7 days. After that, ask for a new link on the sign-in page with this e-mail address.' },
      ...safetyBlocks,
    ]),
  };
}

export function chaseEmail(input: { customerName: string; firmName: string; items: string[]; url: string; reminder?: boolean }) {
  return {
    subject: input.reminder ? 'A reminder: a few things still needed for your charge point' : `${input.firmName} needs a few more things for your charge point`,
    ...renderEmail(`Hello ${firstName(input.customerName)}, a few things are still missing`, [
      { kind: 'p', text: 'Before we can book your survey, we still need:' },
      { kind: 'list', items: input.items.map(endSentence) },
      { kind: 'button', text: 'Carry on with my checklist', href: input.url },
      { kind: 'p', text: 'If something is hard to find, reply and we’ll help.' },
      ...safetyBlocks,
    ]),
  };
}

export function rejectionEmail(input: { customerName: string; what: string; reason: string; goodLooksLike: string; url: string }) {
  return {
    subject: `Please send ${aNew(input.what)}`,
    ...renderEmail(`We need ${aNew(input.what)}`, [
      { kind: 'p', text: `Thank you for sending it. Unfortunately we can’t use this one. Your installer said: ${quoted(endSentence(input.reason))}` },
      { kind: 'p', text: endSentence(`A good one shows: ${input.goodLooksLike}`) },
      { kind: 'button', text: 'Send a new one', href: input.url },
      ...safetyBlocks,
    ]),
  };
}

export function surveyBookedEmail(input: { customerName: string; firmName: string; date: string; surveyorName: string; url: string }) {
  const when = new Intl.DateTimeFormat('en-GB', { weekday: 'long', day: 'numeric', month: 'long', year: 'numeric', timeZone: 'Europe/London' }).format(new Date(`${input.date}T12:00:00Z`));
  return {
    subject: `Your charge point survey is booked for ${when}`,
    ...renderEmail('Your survey is booked', [
      { kind: 'p', text: `${input.surveyorName} from ${input.firmName} will visit on ${when} to survey your home for its charge point.` },
      { kind: 'p', text: 'They’ll want to see the meter, the main fuse, the consumer unit and where you’d like the charge point, so please make sure they can get to them.' },
      { kind: 'button', text: 'See my case', href: input.url },
    ]),
  };
}

/** A new staff member's invitation to choose a password. */
export function staffWelcomeEmail(input: { name: string; adminName: string | null; role: 'admin' | 'surveyor'; url: string }) {
  const account = input.role === 'admin' ? 'an admin account' : 'a surveyor account';
  return {
    subject: 'You have a Groundwork staff account',
    ...renderEmail(`Welcome to Groundwork, ${firstName(input.name)}`, [
      { kind: 'p', text: `${input.adminName ?? 'An admin'} has given you ${account}. Choose a password to start.` },
      { kind: 'button', text: 'Choose my password', href: input.url },
      { kind: 'p', text: 'The link works once and lasts 7 days.' },
    ], 'staff'),
  };
}

/** The office's nudge that a case marked ready has changed. */
/** `change` is describeChange's words, e.g. "changed answers: main fuse rating". */
export function changedSinceReadyEmail(input: { actorName: string; reference: string; change: string; url: string }) {
  return {
    subject: `Case ${input.reference} changed after it was marked ready`,
    ...renderEmail(`${input.actorName} changed case ${input.reference} after it was marked ready`, [
      { kind: 'p', text: `${endSentence(`They ${input.change}`)} Further changes are listed on the case page until the survey is booked.` },
      { kind: 'p', text: 'Look at the checks again before booking the survey.' },
      { kind: 'button', text: 'Open the case', href: input.url },
    ], 'staff'),
  };
}

/** The office's e-mail about a recorded survey: the outcome, what was confirmed and measured, the notes. */
export function surveyRecordedEmail(input: { surveyorName: string | null; reference: string; address: string; outcome: string; found: string[]; notes: string | null; url: string }) {
  return {
    subject: `Survey recorded for ${input.reference}: ${input.outcome}`,
    ...renderEmail(`${input.surveyorName ?? 'The surveyor'} has recorded the survey`, [
      { kind: 'p', text: `Case ${input.reference}, ${input.address}. The case is now Surveyed.` },
      { kind: 'list', items: input.found },
      ...(input.notes ? [{ kind: 'p' as const, text: endSentence(`Notes: ${input.notes}`) }] : []),
      { kind: 'button', text: 'Open the case', href: input.url },
    ], 'staff'),
  };
}
