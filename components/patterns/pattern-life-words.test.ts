import { describe, expect, it } from 'vitest'
import { amountFromCents, centsFromAmount } from './pattern-life-words'

describe('amounts and cents', () => {
  it.each([
    ['12', 1200],
    ['12.5', 1250],
    ['12,50', 1250],
    // 0.29 × 100 is 28.999999999999996 in floating point: counted in integers instead.
    ['0.29', 29],
    [' 7.05 ', 705],
  ])('reads %j as %i cents', (text, cents) => expect(centsFromAmount(text)).toBe(cents))

  it.each(['', 'abc', '12.345', '-3', '1e3'])('refuses %j', (text) => expect(centsFromAmount(text)).toBeNull())

  it('writes cents back with two decimals', () => {
    expect(amountFromCents(1250)).toBe('12.50')
    expect(amountFromCents(5)).toBe('0.05')
  })
})
