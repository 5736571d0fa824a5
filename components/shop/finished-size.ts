import { formatInches, inchesToCentimetres } from '@/lib/units'

/**
 * The ring's finished size as designed, in inches and centimetres.
 *
 * @example finishedSize(18) // '18 in (45.7 cm) across'
 */
export function finishedSize(diameterIn: number): string {
  return `${formatInches(diameterIn)} (${inchesToCentimetres(diameterIn).toFixed(1)} cm) across`
}
