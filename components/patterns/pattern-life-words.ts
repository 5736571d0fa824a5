import type { PatternState } from '@/lib/schemas/pattern'

/** A pattern's state as the screens say it. */
export const STATE_NAMES: Readonly<Record<PatternState, string>> = {
  draft: 'a draft',
  testing: 'in testing',
  published: 'published',
  retired: 'retired',
}

/**
 * An amount typed by a person ("12", "12.5", "12.50") in whole cents, or null when it is not one.
 * Counted in integers, never through a float, so "0.29" is 29.
 *
 * @example centsFromAmount('12.5') // 1250
 */
export function centsFromAmount(text: string): number | null {
  const match = /^\s*(\d{1,7})(?:[.,](\d{1,2}))?\s*$/.exec(text)
  if (!match) return null
  return Number(match[1]) * 100 + Number((match[2] ?? '').padEnd(2, '0'))
}

/**
 * Whole cents as an amount with two decimals.
 *
 * @example amountFromCents(1250) // '12.50'
 */
export function amountFromCents(cents: number): string {
  return `${Math.floor(cents / 100)}.${String(cents % 100).padStart(2, '0')}`
}
