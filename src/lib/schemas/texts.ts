// Text-message opt-in: the customer's mobile and an explicit yes. Pure and client-safe.
import { z } from 'zod';
import { checkUkMobile } from '@/lib/validation/phone';

/**
 * PUT /api/cases/:id/texts. The mobile is stored in E.164; `agree` must be exactly true.
 *
 * @example textConsentSchema.parse({ mobile: '07400 123456', agree: true }) // { mobile: '+447400123456', agree: true }
 */
export const textConsentSchema = z
  .object({
    mobile: z
      .string({ required_error: 'Please enter your mobile number.', invalid_type_error: 'Please type the number as text.' })
      .max(40, 'This is too long for a phone number. Please check it.')
      .transform((value, ctx) => {
        const result = checkUkMobile(value);
        if (result.ok) return result.e164;
        ctx.addIssue({ code: z.ZodIssueCode.custom, message: result.message });
        return z.NEVER;
      }),
    agree: z.literal(true, { errorMap: () => ({ message: 'Please tick the box to agree to text messages.' }) }),
  })
  .strict();

export type TextConsentInput = z.input<typeof textConsentSchema>;
