import { describe, expect, it } from 'vitest';
import * as templates from '@/lib/server/email-templates.server';
import { customerPhotoCautions } from '@/lib/cautions';
import { customerGaps } from '@/lib/gaps';
import { endSentence } from '@/lib/punctuation';

// Every e-mail goes as HTML and as plain text (nodemailer `html` + `text`), and a reader of either
// must get the same words in the same order: the HTML part may add only styling, and the text
// part may add only each button's link. Sentences built from pieces (a quoted reason, a note)
// end once: “Too dark.” and never “Too dark.”. (British usage; common practice — no published
// source for e-mail copy).

type Rendered = { subject: string; text: string; html: string };

const link = 'https://groundwork.example.com/api/auth/callback/nodemailer?token=abc123&email=x%40example.org';
// The office's reasons, as typed: with and without a full stop, and ending in a question mark.
const reasons = ['Too dark to read.', 'Too dark to read', 'Is this the right meter?'];
const rejectedGaps = (reason: string) =>
  customerGaps({}, [{ kind: 'cutout_photo', status: 'rejected', reason }]).map((g) => g.text);

/** One or more renderings of every template, with awkward inputs. */
const samples: Record<string, Rendered[]> = {
  signInLinkEmail: [templates.signInLinkEmail(link)],
  caseSubmittedEmail: [
    templates.caseSubmittedEmail({ reference: 'GW-7K2Q', customer: 'Wren Hollis', address: '4 Tansy Row, Marlow Ferris, ZZ7 4QT', gaps: [], url: link }),
    templates.caseSubmittedEmail({ reference: 'GW-7K2Q', customer: 'Wren Hollis', address: '', gaps: [{ section: 'supply', title: 'Your supply', missing: ['mpan', 'mainFuseAmps'] }], url: link }),
  ],
  invitationEmail: [
    templates.invitationEmail({ customerName: 'Wren Hollis', firmName: 'Brightwire Electrical', url: link }),
    templates.invitationEmail({ customerName: 'Wren', firmName: 'Brightwire Electrical', url: link, note: 'Thanks for calling us on Tuesday.' }),
    templates.invitationEmail({ customerName: '', firmName: 'Brightwire Electrical', url: link, note: 'Thanks for calling us' }),
  ],
  chaseEmail: reasons.flatMap((reason) => [
    templates.chaseEmail({ customerName: 'Wren Hollis', firmName: 'Brightwire Electrical', items: [...customerGaps({}, []).map((g) => g.text), ...rejectedGaps(reason)], url: link }),
    templates.chaseEmail({ customerName: 'Wren Hollis', firmName: 'Brightwire Electrical', items: rejectedGaps(reason), url: link, reminder: true }),
  ]),
  rejectionEmail: reasons.flatMap((reason) => [
    templates.rejectionEmail({ customerName: 'Wren Hollis', what: 'photo of the main fuse (cut-out)', reason, goodLooksLike: 'The fuse carrier with its rating readable.', url: link }),
    templates.rejectionEmail({ customerName: 'Wren Hollis', what: "your landlord's permission", reason, goodLooksLike: 'A letter from your landlord', url: link }),
  ]),
  surveyBookedEmail: [templates.surveyBookedEmail({ customerName: 'Wren Hollis', firmName: 'Brightwire Electrical', date: '2026-12-14', surveyorName: 'Idris', url: link })],
  staffWelcomeEmail: [
    templates.staffWelcomeEmail({ name: 'Tamsin Orrell', adminName: 'Ada Quell', role: 'admin', url: link }),
    templates.staffWelcomeEmail({ name: 'Tamsin Orrell', adminName: null, role: 'surveyor', url: link }),
  ],
  changedSinceReadyEmail: [
    templates.changedSinceReadyEmail({ actorName: 'Wren Hollis', reference: 'GW-7K2Q', change: 'changed answers: main fuse rating', url: link }),
    templates.changedSinceReadyEmail({ actorName: 'Wren Hollis', reference: 'GW-7K2Q', change: 'sent a file: photo of the meter.', url: link }),
  ],
  surveyRecordedEmail: [
    templates.surveyRecordedEmail({ surveyorName: 'Idris Penhale', reference: 'GW-7K2Q', address: '4 Tansy Row', outcome: 'Go ahead', found: ['Outcome: Go ahead', 'Main fuse: 100 A (confirmed on site)'], notes: 'Cut-out is old.', url: link }),
    templates.surveyRecordedEmail({ surveyorName: null, reference: 'GW-7K2Q', address: '4 Tansy Row', outcome: 'Go ahead', found: [], notes: 'Cut-out is old', url: link }),
  ],
};

const decode = (s: string) =>
  s.replace(/&(amp|lt|gt|quot|#39);/g, (_, e: string) => ({ amp: '&', lt: '<', gt: '>', quot: '"', '#39': "'" })[e]!);

/** What a reader of the HTML part sees: the body's text, no markup, no head. */
function htmlWords(html: string): string {
  return decode(html.replace(/<head>[\s\S]*?<\/head>/i, '').replace(/<[^>]+>/g, ' '));
}
/** The plain-text part without the links it spells out. */
function textWords(text: string): string {
  return text.replace(/https?:\/\/\S+/g, ' ');
}
const words = (s: string) => s.toLowerCase().match(/[\p{L}\p{N}’']+/gu) ?? [];
// Two marks in a row (“.”. , .. , ,. , :.) with only closing quotes or brackets between; not "7.4".
const DOUBLED = /[.!?,;:][”"’)\]]*\s*[.!?,;:](?![\d\p{L}])/u;

const all = Object.entries(samples).flatMap(([name, list]) => list.map((mail, i) => ({ name: `${name} #${i + 1}`, mail })));

describe('every e-mail template', () => {
  it('is in the table above (a new template must be rendered here too)', () => {
    const exported = Object.keys(templates).filter((k) => k.endsWith('Email') && k !== 'renderEmail');
    expect(exported.sort()).toEqual(Object.keys(samples).sort());
  });

  it.each(all)('$name: the HTML and plain-text parts carry the same words', ({ mail }) => {
    expect(mail.text.length).toBeGreaterThan(50);
    expect(mail.html).toMatch(/^<!doctype html>/);
    expect(words(htmlWords(mail.html))).toEqual(words(textWords(mail.text)));
  });

  it.each(all)('$name: no doubled punctuation in the subject or either part', ({ mail }) => {
    for (const part of [mail.subject, textWords(mail.text), htmlWords(mail.html)]) {
      expect(part).not.toMatch(DOUBLED);
      expect(part).not.toMatch(/\s[.,;:!?]/);
    }
  });

  it('quotes a rejection reason once, with one full stop', () => {
    const [chase] = samples.chaseEmail!;
    expect(chase!.text).toContain('your installer said: “Too dark to read.”');
    expect(chase!.text).not.toContain('.”.');
    const reject = samples.rejectionEmail!.map((m) => m.text);
    expect(reject[0]).toContain('Your installer said: “Too dark to read.”');
    expect(reject[2]).toContain('Your installer said: “Too dark to read.”');
    expect(reject[4]).toContain('Your installer said: “Is this the right meter?”');
    expect(samples.rejectionEmail![1]!.subject).toBe("Please send your landlord's permission");
    expect(samples.rejectionEmail![0]!.subject).toBe('Please send a new photo of the main fuse (cut-out)');
  });

  it('carries every photo caution, 105 included, in each e-mail that asks for photos, in both parts', () => {
    for (const name of ['chaseEmail', 'rejectionEmail', 'invitationEmail']) {
      for (const mail of samples[name]!) {
        for (const caution of customerPhotoCautions) {
          expect(mail.text).toContain(caution);
          expect(htmlWords(mail.html)).toContain(caution);
        }
        expect(mail.text).toMatch(/call 105/);
      }
    }
  });

  it('speaks for the installer to customers, and not to staff', () => {
    expect(samples.chaseEmail![0]!.text).toContain('on behalf of your installer');
    for (const name of ['staffWelcomeEmail', 'changedSinceReadyEmail', 'surveyRecordedEmail', 'caseSubmittedEmail']) {
      for (const mail of samples[name]!) expect(mail.text).not.toContain('on behalf of your installer');
    }
    expect(samples.staffWelcomeEmail![0]!.text).toContain('has given you an admin account');
    expect(samples.caseSubmittedEmail![1]!.subject).toBe('Case GW-7K2Q sent for review (1 section with gaps)');
  });
});

describe('the missing things a chase lists', () => {
  it('names each thing once, joined as a list is read', () => {
    for (const gap of customerGaps({}, [])) {
      const body = gap.text.slice(gap.text.indexOf(': add ') + 6, -1);
      const parts = body.split(/, | and (?=[^,]*$)/);
      expect(new Set(parts).size, gap.text).toBe(parts.length);
      if (parts.length > 1) expect(gap.text).toMatch(/ and [^,]+\.$/);
    }
  });
});

describe('endSentence', () => {
  // Worked by hand: add a full stop only where none ends the sentence, inside quotes included.
  it.each([
    ['Too dark', 'Too dark.'],
    ['Too dark.', 'Too dark.'],
    ['said: “Too dark.”', 'said: “Too dark.”'],
    ['said: “Too dark”', 'said: “Too dark”.'],
    ['Is it? ', 'Is it?'],
    ['', ''],
  ])('%j → %j', (input, expected) => expect(endSentence(input)).toBe(expected));
});
