// The registration look-up's body. Pure and client-safe; the plate itself is checked on the server.
import { z } from 'zod';

/** @example vehicleLookupSchema.parse({ registration: 'GW29 EVA' }) */
export const vehicleLookupSchema = z
  .object({ registration: z.string({ required_error: 'Please enter the registration number.' }).trim().min(1, 'Please enter the registration number.').max(20, 'A GB number plate has at most seven letters and numbers.') })
  .strict();
