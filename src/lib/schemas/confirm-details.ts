// Client-safe: the body of "these details from my installer are right" (one step's details).
import { z } from 'zod';

/** The "About you" answers an invitation can fill in. */
export const prefillablePaths = ['about.fullName', 'about.email', 'about.phone', 'about.addressLine1', 'about.addressLine2', 'about.town', 'about.postcode'] as const;

/**
 * POST /api/cases/:id/confirm-details: the details the customer confirms.
 * @example confirmDetailsSchema.parse({ paths: ['about.fullName', 'about.email'] })
 */
export const confirmDetailsSchema = z
  .object({
    paths: z
      .array(z.enum(prefillablePaths, { errorMap: () => ({ message: 'Only details from the invitation can be confirmed.' }) }))
      .min(1, 'Name at least one detail to confirm.')
      .max(prefillablePaths.length),
  })
  .strict();
export type ConfirmDetailsBody = z.infer<typeof confirmDetailsSchema>;
