// Server-only: telling "the database is unreachable or timed out" apart from a bug in a query.
// No imports, so both the pool (db.server.ts) and the error wrapper (http.ts) can use it.

// Socket-level failures postgres.js reports, and SQLSTATEs meaning "the server is unreachable,
// restarting, overloaded or cut us off" (PostgreSQL manual, Appendix A: classes 08, 53, 57).
const UNAVAILABLE_CODES = new Set([
  'ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', 'EHOSTUNREACH', 'ENOTFOUND', 'EAI_AGAIN',
  'CONNECT_TIMEOUT', 'CONNECTION_CLOSED', 'CONNECTION_DESTROYED', 'CONNECTION_ENDED',
  '57P01', // admin_shutdown
  '57P02', // crash_shutdown
  '57P03', // cannot_connect_now (starting up or shutting down)
  '57014', // query_canceled (our statement_timeout)
  '25P03', // idle_in_transaction_session_timeout
  '53300', // too_many_connections
  '53200', // out_of_memory
]);

/**
 * True when an error (or what it wraps: Drizzle wraps driver errors in `cause`) means the
 * database is unreachable or timed out, rather than a bug in the query.
 * @example isDatabaseUnavailable(Object.assign(new Error(), { code: 'ECONNREFUSED' })) // true
 */
export function isDatabaseUnavailable(err: unknown): boolean {
  for (let e = err, depth = 0; e && depth < 5; e = (e as { cause?: unknown }).cause, depth++) {
    // Our own 503s (a pool wait that ran out) count too.
    if ((e as { status?: unknown }).status === 503) return true;
    const code = (e as { code?: unknown }).code;
    if (typeof code === 'string' && (UNAVAILABLE_CODES.has(code) || code.startsWith('08'))) return true;
    const errors = (e as { errors?: unknown[] }).errors;
    if (Array.isArray(errors) && errors.some(isDatabaseUnavailable)) return true;
  }
  return false;
}

