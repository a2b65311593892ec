// Client-safe: the admin's settings forms. Readiness thresholds live in src/lib/readiness/settings.ts.
import { z } from 'zod';
import { readinessSettingsSchema } from '@/lib/readiness/settings';

/** Automatic reminders to customers whose case is still being filled in. */
export const reminderSettingsSchema = z
  .object({
    enabled: z.boolean().default(true),
    everyDays: z.number().int().min(1, 'At least every day.').max(30, 'At most every 30 days.').default(3),
    maxReminders: z.number().int().min(0).max(10, 'At most 10 reminders.').default(3),
    // Hours in Great Britain's time between which reminders may go out: never at night.
    sendFromHour: z.number().int().min(0).max(23).default(9),
    sendUntilHour: z.number().int().min(1).max(24).default(19),
  })
  .strict()
  .refine((s) => s.sendUntilHour > s.sendFromHour, { message: 'The end hour must be after the start hour.', path: ['sendUntilHour'] });
export type ReminderSettings = z.output<typeof reminderSettingsSchema>;

/** PUT /api/settings body: either group may be sent; every readiness key is optional. */
export const settingsUpdateSchema = z
  .object({
    readiness: readinessSettingsSchema.partial().strict().optional(),
    reminders: reminderSettingsSchema.optional(),
  })
  .strict();
export type SettingsUpdate = z.infer<typeof settingsUpdateSchema>;
