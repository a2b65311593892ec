// Client-safe: the office's request bodies — stage moves, notes, reviews, chasers, staff.
import { z } from 'zod';
import { stages } from '@/lib/stages';
import { checkIsoDate } from '@/lib/validation/date';
import { emailField } from './sign-in';

export const stageMoveSchema = z
  .object({
    to: z.enum(stages, { errorMap: () => ({ message: 'Choose a stage.' }) }),
    surveyorId: z.string().trim().min(1).max(100).optional(),
    surveyDate: z
      .string()
      .trim()
      .refine((v) => checkIsoDate(v).ok, 'Enter a real date (YYYY-MM-DD).')
      .optional(),
    overrideReason: z.string().trim().min(10, 'Write a reason of at least 10 characters.').max(1000).optional(),
  })
  .strict();
export type StageMove = z.infer<typeof stageMoveSchema>;

export const noteSchema = z.object({ body: z.string().trim().min(1, 'Write a note first.').max(5000, 'Keep a note under 5,000 characters.') }).strict();

export const reviewSchema = z
  .object({
    decision: z.enum(['accepted', 'rejected'], { errorMap: () => ({ message: 'Decide accepted or rejected.' }) }),
    reason: z.string().trim().max(1000, 'Keep the reason under 1,000 characters.').optional(),
  })
  .strict()
  .superRefine((v, ctx) => {
    if (v.decision === 'rejected' && (!v.reason || v.reason.length < 5)) {
      ctx.addIssue({ code: 'custom', path: ['reason'], message: 'Tell the customer why, in a few words (at least 5 characters).' });
    }
  });

export const bulkChaseSchema = z
  .object({ caseIds: z.array(z.string().uuid('Not a case id.')).min(1, 'Pick at least one case.').max(200, 'Chase at most 200 cases at once.') })
  .strict();

export const staffInviteSchema = z
  .object({
    name: z.string().trim().min(1, 'Enter their name.').max(120),
    email: emailField.transform((e) => e.toLowerCase()),
    role: z.enum(['admin', 'surveyor'], { errorMap: () => ({ message: 'Choose admin or surveyor.' }) }),
  })
  .strict();

export const staffUpdateSchema = z.object({ active: z.boolean({ required_error: 'Say whether the account is active.' }) }).strict();

export const setPasswordSchema = z
  .object({ password: z.string().min(12, 'Use at least 12 characters.').max(200) })
  .strict();
