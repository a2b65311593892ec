// Server-only: Groundwork's e-mails, each as HTML with a plain-text part, in one voice.
import { countOf } from '../grammar';
import { staffLabel } from '../vocabulary/fields';
const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

type Block = { kind: 'p'; text: string } | { kind: 'button'; text: string; href: string } | { kind: 'list'; items: string[] };

/** Lays out an e-mail from blocks, so every message looks and reads the same. */
export function renderEmail(title: string, blocks: Block[]): { text: string; html: string } {
  const text = [
    title,
    ...blocks.map((b) =>
      b.kind === 'p' ? b.text : b.kind === 'button' ? `${b.text}: ${b.href}` : b.items.map((i) => `  - ${i}`).join('\n'),
    ),
    '— Groundwork, on behalf of your installer',
  ].join('\n\n');
  const body = blocks
    .map((b) => {
      if (b.kind === 'p') return `<p style="margin:0 0 16px;line-height:1.5">${escapeHtml(b.text)}</p>`;
      if (b.kind === 'list')
        return `<ul style="margin:0 0 16px;padding-left:20px;line-height:1.5">${b.items.map((i) => `<li>${escapeHtml(i)}</li>`).join('')}</ul>`;
      return `<p style="margin:24px 0"><a href="${escapeHtml(b.href)}" style="background:#34635d;color:#fff;padding:12px 20px;border-radius:6px;text-decoration:none;font-weight:600;display:inline-block">${escapeHtml(b.text)}</a></p>`;
    })
    .join('\n');
  const html = `<!doctype html><html><body style="margin:0;background:#fbfaf7;font-family:'Source Sans 3',Arial,sans-serif;color:#1d2524">
<div style="max-width:560px;margin:0 auto;padding:24px">
<div style="font-weight:700;font-size:18px;color:#2b504c;margin-bottom:16px">Groundwork</div>
<h1 style="font-size:22px;margin:0 0 16px">${escapeHtml(title)}</h1>
${body}
<p style="margin:32px 0 0;font-size:13px;color:#5b6664">Groundwork, on behalf of your installer. If you weren't expecting this e-mail, you can ignore it.</p>
</div></body></html>`;
  return { text, html };
}

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
    ]),
  };
}

export function invitationEmail(input: { customerName: string; firmName: string; url: string; note?: string }) {
  return {
    subject: `${input.firmName}: let’s get your home ready for its charge point`,
    ...renderEmail(`Hello ${input.customerName.split(' ')[0]}, let’s get your home ready`, [
      {
        kind: 'p',
        text:
          `${input.firmName} uses Groundwork to collect what they need before your charge point survey. ` +
          'You’ll be asked about you and your home, your car and when it arrives, your electricity supply (the MPAN from a bill, ' +
          'and photos of your meter, main fuse and fuse box — photos only, never open anything), where the car parks, and where ' +
          'you’d like the charger. It saves as you go, so you can do it in several sittings, on your phone or a computer.',
      },
      ...(input.note ? [{ kind: 'p' as const, text: `A note from ${input.firmName}: ${input.note}` }] : []),
      { kind: 'button', text: 'Start my checklist', href: input.url },
      { kind: 'p', text: 'This link signs you in once and lasts 7 days. After that, ask for a new link on the sign-in page with this e-mail address.' },
    ]),
  };
}

export function chaseEmail(input: { customerName: string; firmName: string; items: string[]; url: string; reminder?: boolean }) {
  return {
    subject: input.reminder ? 'A reminder: a few things still needed for your charge point' : `${input.firmName} needs a few more things for your charge point`,
    ...renderEmail(`Hello ${input.customerName.split(' ')[0]}, a few things are still missing`, [
      { kind: 'p', text: 'Before we can book your survey, we still need:' },
      { kind: 'list', items: input.items },
      { kind: 'button', text: 'Carry on with my checklist', href: input.url },
      { kind: 'p', text: 'Photos only, please: never open the meter, the main fuse or your fuse box. If something is hard to find, reply and we’ll help.' },
    ]),
  };
}

export function rejectionEmail(input: { customerName: string; what: string; reason: string; goodLooksLike: string; url: string }) {
  return {
    subject: `Please send a new ${input.what}`,
    ...renderEmail(`We need a new ${input.what}`, [
      { kind: 'p', text: `Thank you for sending it. Unfortunately we can’t use this one: ${input.reason}` },
      { kind: 'p', text: `A good one shows: ${input.goodLooksLike}` },
      { kind: 'button', text: 'Send a new one', href: input.url },
      { kind: 'p', text: 'Photos only: never open the meter, the main fuse (cut-out) or your fuse box, and never remove covers.' },
    ]),
  };
}

export function surveyBookedEmail(input: { customerName: string; firmName: string; date: string; surveyorName: string; url: string }) {
  const when = new Intl.DateTimeFormat('en-GB', { weekday: 'long', day: 'numeric', month: 'long', year: 'numeric', timeZone: 'Europe/London' }).format(new Date(`${input.date}T12:00:00Z`));
  return {
    subject: `Your charge point survey is booked for ${when}`,
    ...renderEmail('Your survey is booked', [
      { kind: 'p', text: `${input.surveyorName} from ${input.firmName} will visit on ${when} to survey your home for its charge point.` },
      { kind: 'p', text: 'They’ll want to see the meter, the main fuse, the consumer unit and where you’d like the charger, so please make sure they can get to them.' },
      { kind: 'button', text: 'See my case', href: input.url },
    ]),
  };
}
