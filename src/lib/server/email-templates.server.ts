// Server-only: Groundwork's e-mails, each as HTML with a plain-text part, in one voice.
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

export function caseSubmittedEmail(input: { reference: string; customer: string; address: string; gaps: { title: string; missing: string[] }[]; url: string }) {
  const gapLines = input.gaps.map((g) => `${g.title}: ${g.missing.join(', ')}`);
  return {
    subject: `Case ${input.reference} sent for review${input.gaps.length ? ` (${input.gaps.length} sections with gaps)` : ''}`,
    ...renderEmail(`${input.customer} has sent their case for review`, [
      { kind: 'p', text: `Case ${input.reference}, ${input.address || 'address not given yet'}.` },
      ...(gapLines.length
        ? [{ kind: 'p' as const, text: 'They sent it with these gaps:' }, { kind: 'list' as const, items: gapLines }]
        : [{ kind: 'p' as const, text: 'Every section of the checklist is complete.' }]),
      { kind: 'button', text: 'Open the case', href: input.url },
    ]),
  };
}
