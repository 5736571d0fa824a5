/**
 * How long a step's unsaved change waits before it is sent again. Exponential back-off with
 * "full jitter" (a random delay up to the exponential cap; common practice for retries, so a room
 * of phones coming back online do not all knock at once), never shorter than a floor so a tick
 * never hammers a server that just refused it.
 */

/** The first retry waits up to this long, milliseconds. */
export const FIRST_RETRY_MS = 1_000
/** No retry waits longer than this, milliseconds: a quilter's tick should land within half a minute of the connection coming back. */
export const LONGEST_RETRY_MS = 30_000
/** Shortest wait, milliseconds, whatever the jitter draws. */
const SHORTEST_RETRY_MS = 250

/**
 * The wait before attempt number `failures + 1`, after `failures` failed attempts (1 or more).
 * `random` draws from [0, 1); pass a fixed value in tests. A server's Retry-After (seconds), when
 * given, is honoured as the shortest wait.
 *
 * @example retryDelayMs(1, () => 0.5) // 500
 */
export function retryDelayMs(failures: number, random: () => number = Math.random, retryAfterSeconds?: number): number {
  const exponent = Math.max(0, Math.min(failures - 1, 16))
  const cap = Math.min(LONGEST_RETRY_MS, FIRST_RETRY_MS * 2 ** exponent)
  const drawn = Math.max(SHORTEST_RETRY_MS, Math.floor(random() * cap))
  const floor = retryAfterSeconds !== undefined && Number.isFinite(retryAfterSeconds) && retryAfterSeconds > 0 ? Math.min(retryAfterSeconds * 1000, LONGEST_RETRY_MS * 4) : 0
  return Math.max(drawn, floor)
}
