// Client-safe: the office queue's query, shared by the table island (which keeps it in the URL)
// and GET /api/cases (which parses it).
import { z } from 'zod';
import { stages } from '@/lib/stages';

export const lights = ['red', 'amber', 'green'] as const;
export const queueSortKeys = ['customer', 'address', 'light', 'gaps', 'stage', 'invited', 'activity', 'delivery', 'surveyor', 'survey'] as const;
export type QueueSortKey = (typeof queueSortKeys)[number];

// A comma-separated list in the query string, e.g. ?light=red,amber
const list = <T extends [string, ...string[]]>(values: T, name: string) =>
  z
    .string()
    .transform((s) => s.split(',').map((v) => v.trim()).filter(Boolean))
    .pipe(z.array(z.enum(values, { errorMap: () => ({ message: `Unknown ${name}: use ${values.join(', ')}.` }) })));

export const queueQuerySchema = z
  .object({
    light: list([...lights], 'light').optional(),
    stage: list([...stages], 'stage').optional(),
    surveyor: z.string().trim().min(1).max(100).optional(),
    q: z.string().trim().max(100, 'Search for at most 100 characters.').optional(),
    deliveryWithin: z.coerce.number({ invalid_type_error: 'deliveryWithin is a number of days.' }).int().min(0).max(365).optional(),
    // Cases with a photo the check at upload flagged that the office has not yet reviewed.
    photos: z.enum(['flagged'], { errorMap: () => ({ message: 'photos is flagged.' }) }).optional(),
    sort: z.enum(queueSortKeys, { errorMap: () => ({ message: `Sort by one of: ${queueSortKeys.join(', ')}.` }) }).default('light'),
    dir: z.enum(['asc', 'desc'], { errorMap: () => ({ message: 'dir is asc or desc.' }) }).default('asc'),
    // 1e308 is an "integer" to JavaScript: without a ceiling it reached PostgreSQL as an offset.
    page: z.coerce.number({ invalid_type_error: 'page is a number.' }).int().min(1, 'page starts at 1.').max(100_000, 'page is at most 100000.').default(1),
    pageSize: z.coerce.number({ invalid_type_error: 'pageSize is a number.' }).int().min(1).max(200, 'pageSize is at most 200.').default(50),
  })
  .strict();
export type QueueQuery = z.output<typeof queueQuerySchema>;

/** Reads the query from URL search params, dropping empty values. */
export function queueQueryFromParams(params: URLSearchParams) {
  const raw: Record<string, string> = {};
  for (const [k, v] of params) if (v !== '') raw[k] = v;
  return queueQuerySchema.safeParse(raw);
}

/** One row of the queue, as GET /api/cases answers it for staff. */
export type QueueItem = {
  id: string;
  reference: string;
  customerName: string | null;
  customerEmail: string;
  addressLine1: string | null;
  town: string | null;
  postcode: string | null;
  light: (typeof lights)[number];
  gapCount: number;
  gaps: string[];
  stage: (typeof stages)[number];
  invitedAt: string;
  daysSinceInvite: number;
  lastCustomerActivityAt: string | null;
  deliveryDate: string | null;
  surveyorId: string | null;
  surveyorName: string | null;
  surveyDate: string | null;
  /** Set when the customer changed something after the office marked the case ready. */
  changedSinceReadyAt: string | null;
  /** Photos the check at upload flagged that are still waiting for review. */
  flaggedPhotos: number;
};
