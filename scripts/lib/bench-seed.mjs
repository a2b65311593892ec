// Invented customers and cases for the benchmarks, made in SQL so 100,000 rows take seconds.
// Every third has no parking (red), the rest are amber or green; postcodes and MPAN-shaped
// numbers vary. Rows from..to (inclusive) are added; call again with the next range to grow.
import { log } from './stack.mjs';

export async function seedBenchCases(sql, from, to) {
  log(`Seeding cases ${from}–${to}…`);
  await sql`
    insert into users (id, name, email, role)
    select 'bench-' || g, 'Bench Customer ' || g, 'bench' || g || '@example.org', 'customer'
    from generate_series(${from}::int, ${to}::int) g`;
  await sql`
    insert into cases (reference, customer_id, address_line1, town, postcode, stage, checklist, invited_at,
                       readiness_light, readiness_rank, readiness_gaps, readiness_checks, search_text)
    select 'GWB' || lpad(g::text, 6, '0'), 'bench-' || g, g || ' Bench Street', 'Quillbury',
           'AB' || (g % 9 + 1) || ' ' || (g % 10) || 'XY',
           (array['invited','filling_in','sent_for_review','in_review','ready_for_survey'])[g % 5 + 1]::case_stage,
           jsonb_build_object('supply', jsonb_build_object('mpanCore', (1000000000000 + g)::text),
                              'vehicle', jsonb_build_object('deliveryDate', to_char(now()::date + (g % 90), 'YYYY-MM-DD'))),
           now() - (g % 60) * interval '1 day',
           (array['red','amber','green'])[g % 3 + 1]::readiness_light, g % 3, g % 9,
           jsonb_build_array(jsonb_build_object('id', 'parking', 'light', (array['red','amber','green'])[g % 3 + 1], 'title', 'Parking')),
           -- The same words src/db/search-text.ts puts there: name, e-mail, postcode without its space, reference, MPAN.
           lower(concat_ws(' ', 'Bench Customer ' || g, 'bench' || g || '@example.org', 'AB' || (g % 9 + 1) || (g % 10) || 'XY',
                           'GWB' || lpad(g::text, 6, '0'), (1000000000000 + g)::text))
    from generate_series(${from}::int, ${to}::int) g`;
  await sql`vacuum analyze cases`;
  await sql`vacuum analyze users`;
}
