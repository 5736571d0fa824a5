import { formatInches } from '@/lib/units'
import type { PatternSummary } from '@/lib/schemas/pattern'

/**
 * The design's summary kept beside it (lib/design-summary.ts), in words for the shelf.
 *
 * @example ringInWords({ repeats: 4, outerDiameterInches: 18, seamCount: 24 }) // '4 repeats · 18 in across · 24 seams'
 */
export function ringInWords(pattern: Pick<PatternSummary, 'repeats' | 'outerDiameterInches' | 'seamCount'>): string {
  if (pattern.repeats === 0) return '—' // a design that could not be read when it was summarised
  const seams = `${pattern.seamCount} ${pattern.seamCount === 1 ? 'seam' : 'seams'}`
  return `${pattern.repeats} repeats · ${formatInches(pattern.outerDiameterInches)} across · ${seams}`
}
