// The office search's one column: how it is built, shared by the app and the test factories.
import { sql, type SQL } from 'drizzle-orm';

/** SQL that rewrites cases.search_text for one case (or all when caseId is omitted). */
export function refreshSearchTextSql(caseId?: string): SQL {
  return sql`update cases c set search_text = lower(concat_ws(' ', u.name, u.email, replace(coalesce(c.postcode, ''), ' ', ''), c.reference, c.checklist -> 'supply' ->> 'mpanCore'))
    from users u where u.id = c.customer_id ${caseId ? sql`and c.id = ${caseId}` : sql``}`;
}

/** Turns what the office typed into the ILIKE pattern for search_text (postcode spaces ignored). */
export function searchPattern(q: string): string {
  const escaped = q.toLowerCase().replace(/[\\%_]/g, (c) => `\\${c}`);
  return `%${escaped}%`;
}
