// Client-safe: the body of "these details from my installer are right".
import { z } from 'zod';

/** POST /api/cases/:id/confirm-details. @example confirmDetailsSchema.parse({ confirm: true }) */
export const confirmDetailsSchema = z
  .object({ confirm: z.literal(true, { errorMap: () => ({ message: 'Send confirm: true to confirm the details.' }) }) })
  .strict();
export type ConfirmDetailsBody = z.infer<typeof confirmDetailsSchema>;
