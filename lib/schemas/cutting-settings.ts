/**
 * The two settings of the fabric arithmetic a person may change: the usable width of fabric
 * (inches) and the extra added to every amount (percent). One schema and one pair of ranges, so
 * the command line (`cutting --width-of-fabric --extra`), the fabric page and the booklet accept
 * the same values and say the same thing about the rest. The defaults are geometry's.
 */
import { z } from 'zod'
import { DEFAULT_EXTRA_PERCENT, DEFAULT_WIDTH_OF_FABRIC_INCHES } from '@/geometry/yardage'

/**
 * Usable width of fabric accepted, inches: 10 to 120 (quilting cotton is about 40 in usable, the
 * widest backing fabrics sold are about 108 in; common practice). Narrower than 10 in is no bolt.
 */
export const WIDTH_OF_FABRIC_RANGE_INCHES = [10, 120] as const
/** Extra accepted, percent: 0 to 100 (common practice is 10 %; doubling is already a lot). */
export const EXTRA_PERCENT_RANGE = [0, 100] as const

const [leastWidth, mostWidth] = WIDTH_OF_FABRIC_RANGE_INCHES
const [leastExtra, mostExtra] = EXTRA_PERCENT_RANGE

/**
 * A width in inches, checked to a thousandth of an inch so a width typed in centimetres
 * (304.8 cm) is 120 in whatever the division left in the last digit.
 */
export const widthOfFabricSchema = z
  .number({ error: 'The usable width of fabric must be a number of inches.' })
  .refine((inches) => Number.isFinite(inches) && Math.round(inches * 1000) / 1000 >= leastWidth && Math.round(inches * 1000) / 1000 <= mostWidth, {
    error: `The usable width of fabric must be between ${leastWidth} and ${mostWidth} in.`,
  })

export const extraPercentSchema = z
  .number({ error: 'The extra must be a number (percent).' })
  .min(leastExtra, { error: `The extra must be between ${leastExtra} and ${mostExtra} %.` })
  .max(mostExtra, { error: `The extra must be between ${leastExtra} and ${mostExtra} %.` })

/**
 * The cutting settings with their defaults (40 in, 10 %), as the booklet options carry them.
 *
 * @example cuttingSettingsSchema.parse({}) // { widthOfFabricIn: 40, extraPercent: 10 }
 */
export const cuttingSettingsSchema = z.strictObject({
  widthOfFabricIn: widthOfFabricSchema.default(DEFAULT_WIDTH_OF_FABRIC_INCHES),
  extraPercent: extraPercentSchema.default(DEFAULT_EXTRA_PERCENT),
})
