import { BaseError, ConnectionError } from 'sequelize'

/**
 * Whether an error means the database could not be reached or dropped the connection: PostgreSQL
 * restarting, failing over, shutting down or full — something that passes, not a fault of the
 * request or of the code. lib/http.ts answers these with 503 and `Retry-After` instead of a 500.
 *
 * What counts (SQLSTATE codes from PostgreSQL's documentation, Appendix A "PostgreSQL Error Codes"):
 * - Sequelize's ConnectionError family (refused, timed out, host not found or unreachable, no free
 *   connection in the pool within its wait, the connection refused by the server at start);
 * - SQLSTATE 57P01 admin_shutdown (a fast shutdown or restart ends every session), 57P02
 *   crash_shutdown, 57P03 cannot_connect_now (starting up or shutting down), 53300
 *   too_many_connections, and class 08 connection_exception;
 * - node-postgres's own words for a connection that went away ("Connection terminated
 *   unexpectedly", a client "not queryable" after such an error, the pool's connect timeout);
 * - a socket error (ECONNREFUSED, ECONNRESET, …) that Sequelize reports as the cause of a
 *   database error. The same code on its own is not counted: it may come from the object store or
 *   another service, which is not the database and stays a 500.
 * Sequelize keeps the driver's error as `original`/`parent`; others chain it as `cause`; an
 * AggregateError (one try per address of the host) holds several. All of them are looked at.
 */
export function isDatabaseUnavailable(error: unknown): boolean {
  return unavailable(error, false, 0)
}

/** The SQLSTATE codes above that are not in class 08. */
const UNAVAILABLE_SQLSTATES = new Set(['57P01', '57P02', '57P03', '53300'])

/** Socket errors, counted only below a Sequelize error (see above). */
const SOCKET_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'EPIPE', 'ETIMEDOUT', 'EHOSTUNREACH', 'ENETUNREACH', 'ENOTFOUND', 'EAI_AGAIN'])

/** node-postgres's (pg and pg-pool) messages for a lost or unobtainable connection. */
const LOST_CONNECTION = /^Connection terminated( unexpectedly)?$|has encountered a connection error and is not queryable|^timeout exceeded when trying to connect$/

function unavailable(error: unknown, underSequelize: boolean, depth: number): boolean {
  if (depth > 5 || typeof error !== 'object' || error === null) return false
  if (error instanceof ConnectionError) return true
  const { code, message, original, parent, cause, errors } = error as {
    code?: unknown
    message?: unknown
    original?: unknown
    parent?: unknown
    cause?: unknown
    errors?: unknown
  }
  if (typeof code === 'string' && (UNAVAILABLE_SQLSTATES.has(code) || /^08[0-9A-Z]{3}$/.test(code))) return true
  if (typeof message === 'string' && LOST_CONNECTION.test(message)) return true
  if (underSequelize && typeof code === 'string' && SOCKET_CODES.has(code)) return true
  const below = underSequelize || error instanceof BaseError
  const inner = [original, parent, cause, ...(Array.isArray(errors) ? errors : [])]
  return inner.some((next) => next !== error && unavailable(next, below, depth + 1))
}

/**
 * The `Retry-After` of a 503 for an unreachable database, in seconds: a quick restart or a
 * fail-over takes a few seconds, and lib/db.ts has already tried for about 1.7 s before the error
 * reaches the request. Our choice.
 */
export const DATABASE_RETRY_AFTER_SECONDS = 5
