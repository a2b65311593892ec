#!/usr/bin/env node
// Writes src/lib/validation/uk-phone-metadata.json: libphonenumber-js's own "min" metadata cut
// down to calling code +44 (the UK and the Crown Dependencies that share its numbering plan), the
// only numbers Groundwork accepts. libphonenumber-js documents this use of `libphonenumber-js/core`
// with custom metadata; it keeps the browser from downloading every country's rules (≈ 80 KB).
// Run after upgrading libphonenumber-js; tests/unit/validation-phone.test.ts checks it is current.
import { readFileSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

/** The +44 part of libphonenumber-js's metadata, in the library's own format. */
export function ukMetadata(full) {
  const countries = full.country_calling_codes['44'];
  return {
    version: full.version,
    country_calling_codes: { 44: countries },
    countries: Object.fromEntries(countries.map((c) => [c, full.countries[c]])),
    nonGeographic: {},
  };
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  const root = new URL('..', import.meta.url);
  const full = JSON.parse(readFileSync(new URL('node_modules/libphonenumber-js/metadata.min.json', root), 'utf8'));
  writeFileSync(new URL('src/lib/validation/uk-phone-metadata.json', root), `${JSON.stringify(ukMetadata(full))}\n`);
  console.log(`uk-phone-metadata.json: ${full.country_calling_codes['44'].join(', ')} from libphonenumber-js metadata v${full.version}`);
}
