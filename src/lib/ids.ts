// Ids in URLs are checked before any query: PostgreSQL would refuse a malformed uuid with an
// error (a 500), where the visitor deserves a plain 404.
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** @example isUuid('0b5e7c9a-1d2f-4e3a-9b8c-7d6e5f4a3b2c') // true; isUuid('-'.repeat(36)) // false */
export const isUuid = (value: string | undefined): value is string => typeof value === 'string' && UUID.test(value);
