// Client-safe: inviting a customer, one at a time or from a CSV file.
import { z } from 'zod';
import { emailField } from './sign-in';
import { checkPostcode } from '@/lib/validation/postcode';
import { checkUkPhone } from '@/lib/validation/phone';

const optionalText = (max: number) =>
  z
    .string()
    .trim()
    .max(max, `Keep this to ${max} characters or fewer.`)
    .optional()
    .transform((v) => (v ? v : undefined));

export const inviteSchema = z
  .object({
    customer: z
      .object({
        name: z.string({ required_error: 'Enter the customer’s name.' }).trim().min(1, 'Enter the customer’s name.').max(120),
        email: emailField.transform((e) => e.toLowerCase()),
        phone: optionalText(40).superRefine((v, ctx) => {
          if (v && !checkUkPhone(v).ok) ctx.addIssue({ code: 'custom', message: 'Enter a UK phone number, like 0113 496 0123 or 020 7946 0958.' });
        }).transform((v) => {
          if (!v) return undefined;
          const r = checkUkPhone(v);
          return r.ok ? r.e164 : v;
        }),
      })
      .strict(),
    address: z
      .object({
        addressLine1: optionalText(200),
        addressLine2: optionalText(200),
        town: optionalText(100),
        postcode: optionalText(10).superRefine((v, ctx) => {
          if (v && !checkPostcode(v).ok) ctx.addIssue({ code: 'custom', message: 'Enter a UK postcode, like AB1 2DE.' });
        }).transform((v) => {
          if (!v) return undefined;
          const r = checkPostcode(v);
          return r.ok ? r.postcode : v;
        }),
      })
      .strict()
      .optional(),
    note: optionalText(2000),
  })
  .strict();
export type InviteInput = z.input<typeof inviteSchema>;
export type Invite = z.output<typeof inviteSchema>;

/** The CSV columns a bulk invitation reads (header row required, any order). */
export const inviteCsvColumns = ['name', 'email', 'phone', 'addressLine1', 'addressLine2', 'town', 'postcode', 'note'] as const;

/** Turns one CSV row (by header) into the invite body, so the same schema checks it. */
export function inviteFromCsvRow(row: Record<string, string | undefined>): InviteInput {
  const pick = (k: string) => (row[k] ?? '').trim() || undefined;
  return {
    customer: { name: pick('name') ?? '', email: pick('email') ?? '', phone: pick('phone') },
    address: { addressLine1: pick('addressLine1'), addressLine2: pick('addressLine2'), town: pick('town'), postcode: pick('postcode') },
    note: pick('note'),
  };
}

/** POST /api/cases/import: up to 500 rows; dryRun checks every row and creates nothing. */
export const inviteImportSchema = z
  .object({
    rows: z.array(z.unknown()).min(1, 'The file has no rows.').max(500, 'Import at most 500 rows at a time.'),
    dryRun: z.boolean().default(true),
  })
  .strict();
