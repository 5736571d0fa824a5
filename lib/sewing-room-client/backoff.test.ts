import { describe, expect, it } from 'vitest'
import { FIRST_RETRY_MS, LONGEST_RETRY_MS, retryDelayMs } from './backoff'

describe('retryDelayMs', () => {
  it('doubles its cap with each failure', () => {
    const top = () => 0.999999
    expect(retryDelayMs(1, top)).toBe(FIRST_RETRY_MS - 1)
    // 1 s × 2² = 4 s cap after the third failure
    expect(retryDelayMs(3, top)).toBe(4 * FIRST_RETRY_MS - 1)
  })

  it('never waits longer than the longest retry, however many failures', () => {
    expect(retryDelayMs(50, () => 0.999999)).toBeLessThan(LONGEST_RETRY_MS)
  })

  it('never waits less than a quarter second, even when the draw is zero', () => {
    expect(retryDelayMs(1, () => 0)).toBe(250)
  })

  it('waits at least as long as the server asked with Retry-After', () => {
    expect(retryDelayMs(1, () => 0, 12)).toBe(12_000)
    expect(retryDelayMs(1, () => 0, Number.NaN)).toBe(250)
  })

  it('spreads retries out with the random draw', () => {
    expect(retryDelayMs(4, () => 0.25)).toBe(2_000) // cap 8 s × 0.25
    expect(retryDelayMs(4, () => 0.75)).toBe(6_000)
  })
})
