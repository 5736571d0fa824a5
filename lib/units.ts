/**
 * Exact unit factors, the one place they are written down. Lengths are inches in the core,
 * PDF drawing is in points, people read inches or centimetres.
 *
 * - 1 in = 25.4 mm exactly (international yard and pound agreement, 1959);
 * - 1 PDF user-space unit = 1/72 in (ISO 32000-1:2008 §8.3.2.3), so 1 in = 72 pt.
 */

/** Millimetres per inch, exact (1959 agreement). */
export const MILLIMETRES_PER_INCH = 25.4
/** Centimetres per inch, exact. */
export const CENTIMETRES_PER_INCH = 2.54
/** PDF points per inch, exact (ISO 32000-1:2008 §8.3.2.3, default user space). */
export const POINTS_PER_INCH = 72

/**
 * Inches to PDF points.
 *
 * @example inchesToPoints(1) // 72
 */
export function inchesToPoints(inches: number): number {
  return inches * POINTS_PER_INCH
}

/**
 * PDF points to inches.
 *
 * @example pointsToInches(36) // 0.5
 */
export function pointsToInches(points: number): number {
  return points / POINTS_PER_INCH
}

/**
 * Millimetres to PDF points.
 *
 * @example millimetresToPoints(210) // 595.2755905511812 (A4's width)
 */
export function millimetresToPoints(millimetres: number): number {
  return (millimetres / MILLIMETRES_PER_INCH) * POINTS_PER_INCH
}

/**
 * Centimetres to PDF points.
 *
 * @example centimetresToPoints(2) // 56.69291338582677
 */
export function centimetresToPoints(centimetres: number): number {
  return (centimetres / CENTIMETRES_PER_INCH) * POINTS_PER_INCH
}

/**
 * Inches to centimetres.
 *
 * @example inchesToCentimetres(1) // 2.54
 */
export function inchesToCentimetres(inches: number): number {
  return inches * CENTIMETRES_PER_INCH
}

/**
 * Centimetres to inches.
 *
 * @example centimetresToInches(2.54) // 1
 */
export function centimetresToInches(centimetres: number): number {
  return centimetres / CENTIMETRES_PER_INCH
}

/** The units a design file is written in and a designer reads lengths in. */
export type LengthUnits = 'in' | 'cm'

/**
 * How many of a design's units make one inch: 1 for inches, 2.54 for centimetres.
 *
 * @example unitsPerInch('cm') // 2.54
 */
export function unitsPerInch(units: LengthUnits): number {
  return units === 'cm' ? CENTIMETRES_PER_INCH : 1
}

/**
 * A length in inches written the way rulers read it, to the nearest 1/8 in: `2 3/8 in`, `-1/4 in`.
 * The one length formatter of the app (the board, the print room and the booklet all use it).
 *
 * @example formatInches(2.375) // '2 3/8 in'
 */
export function formatInches(inches: number): string {
  return `${inchesInEighths(inches)} in`
}

/**
 * A length (inches in) in the reader's units: eighths of an inch, or centimetres to one decimal.
 *
 * @example formatLength(2.375, 'cm') // '6.0 cm'
 */
export function formatLength(inches: number, units: LengthUnits): string {
  return units === 'cm' ? `${centimetresToMillimetre(inches)} cm` : formatInches(inches)
}

/**
 * A piece's size (inches in), with the unit written once.
 *
 * @example formatSize(3.25, 2.5, 'in') // '3 1/4 × 2 1/2 in'
 */
export function formatSize(widthInches: number, heightInches: number, units: LengthUnits): string {
  if (units === 'cm') return `${centimetresToMillimetre(widthInches)} × ${centimetresToMillimetre(heightInches)} cm`
  return `${inchesInEighths(widthInches)} × ${inchesInEighths(heightInches)} in`
}

/** Inches to the nearest eighth, without the unit: `2 3/8`, `-1/4`, `0`. */
function inchesInEighths(inches: number): string {
  const eighths = Math.round(inches * 8)
  const sign = eighths < 0 ? '-' : ''
  const whole = Math.floor(Math.abs(eighths) / 8)
  let numerator = Math.abs(eighths) % 8
  let denominator = 8
  while (numerator > 0 && numerator % 2 === 0) {
    numerator /= 2
    denominator /= 2
  }
  const fraction = numerator > 0 ? `${numerator}/${denominator}` : ''
  const body = whole > 0 && fraction ? `${whole} ${fraction}` : whole > 0 ? `${whole}` : fraction || '0'
  return `${sign}${body}`
}

/** Inches as centimetres to one decimal, never "-0.0" for a length that rounds to nothing. */
function centimetresToMillimetre(inches: number): string {
  const tenths = Math.round(inchesToCentimetres(inches) * 10)
  return (tenths === 0 ? 0 : tenths / 10).toFixed(1)
}
