// Client-safe: the body of "send for review".
import { z } from 'zod';

export const submitSchema = z
  .object({ acknowledgeGaps: z.boolean({ invalid_type_error: 'acknowledgeGaps must be true or false.' }).default(false) })
  .strict();
export type SubmitBody = z.infer<typeof submitSchema>;
