/**
 * Lengths as a quilter reads them: inches in eighths ("3 1/4 in"), centimetres to a millimetre.
 */
const EIGHTHS = ['', '1/8', '1/4', '3/8', '1/2', '5/8', '3/4', '7/8']

/**
 * Formats inches to the nearest 1/8 in, e.g. `formatInches(3.25)` → "3 1/4 in".
 * Rough-cut sizes are already whole eighths, so nothing is lost there.
 */
export function formatInches(inches: number): string {
  const eighths = Math.round(inches * 8)
  const whole = Math.floor(eighths / 8)
  const fraction = EIGHTHS[eighths % 8]
  if (!fraction) return `${whole} in`
  return whole === 0 ? `${fraction} in` : `${whole} ${fraction} in`
}

/** A length given in inches, shown in the designer's chosen units. 1 in = 2.54 cm (1959 agreement). */
export function formatLength(inches: number, units: 'in' | 'cm'): string {
  return units === 'cm' ? `${(inches * 2.54).toFixed(1)} cm` : formatInches(inches)
}

/** A rough-cut piece's size, e.g. "3 1/4 × 2 1/2 in". */
export function formatSize(widthInches: number, heightInches: number, units: 'in' | 'cm'): string {
  if (units === 'cm') return `${(widthInches * 2.54).toFixed(1)} × ${(heightInches * 2.54).toFixed(1)} cm`
  return `${formatInches(widthInches).replace(/ in$/, '')} × ${formatInches(heightInches)}`
}
