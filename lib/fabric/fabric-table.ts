/**
 * The fabric table of one colourway: a row per fabric (what it is called, its colour, how many
 * pieces, what to buy), sorting by any column, the totals, the words a quilt shop uses for the
 * amounts, and the CSV export. No React: the fabric page and the tests share it. The numbers come
 * from the core's `fabricRequirements`; nothing here recomputes them.
 */
import Papa from 'papaparse'
import type { FabricRequirements } from '@/geometry'
import { centimetresToInches, inchesToCentimetres, type LengthUnits } from '@/lib/units'
import { EXTRA_PERCENT_RANGE, WIDTH_OF_FABRIC_RANGE_INCHES } from '@/lib/schemas/cutting-settings'

export interface FabricRow {
  /** The fabric role (a key, never shown where `name` exists). */
  readonly fabric: string
  /** The display name, from `fabricDisplayName` through the core. */
  readonly name: string
  /** #rrggbb, or null when the colourway gives none. */
  readonly color: string | null
  /** Straight-grain pieces to cut (bias squares count as pieces). */
  readonly pieces: number
  /** The layout's length before the extra, inches. */
  readonly lengthIn: number
  readonly yards: number
  readonly metres: number
  readonly fatQuarter: boolean
  readonly fatEighth: boolean
}

export const FABRIC_COLUMNS = ['name', 'color', 'pieces', 'yards', 'metres', 'fatQuarter', 'fatEighth'] as const
export type FabricColumn = (typeof FABRIC_COLUMNS)[number]
export type SortDirection = 'ascending' | 'descending'

/** Column headings as the screen and the CSV show them. */
export const FABRIC_COLUMN_TITLES: Readonly<Record<FabricColumn, string>> = {
  name: 'Fabric',
  color: 'Swatch',
  pieces: 'Pieces',
  yards: 'Yards',
  metres: 'Metres',
  fatQuarter: 'Fat quarter?',
  fatEighth: 'Fat eighth?',
}

/**
 * One row per fabric of the requirements, in their order (first used first).
 *
 * @example fabricRows(requirements)[0] // { fabric: 'background', name: 'background', pieces: 12, yards: 0.25, … }
 */
export function fabricRows(requirements: FabricRequirements): FabricRow[] {
  return requirements.fabrics.map((fabric) => ({
    fabric: fabric.fabric,
    name: fabric.name,
    color: fabric.color,
    pieces: fabric.pieces.reduce((sum, piece) => sum + piece.count, 0),
    lengthIn: fabric.lengthIn,
    yards: fabric.yards,
    metres: fabric.metres,
    fatQuarter: fabric.fatQuarter,
    fatEighth: fabric.fatEighth,
  }))
}

/** Luma of #rrggbb with ITU-R BT.709's weights: enough to order swatches dark to light; no colour sorts last. */
function lightness(color: string | null): number {
  if (!color || !/^#[0-9a-fA-F]{6}$/.test(color)) return Number.POSITIVE_INFINITY
  const [r, g, b] = [1, 3, 5].map((at) => parseInt(color.slice(at, at + 2), 16))
  return 0.2126 * r! + 0.7152 * g! + 0.0722 * b!
}

function compare(a: FabricRow, b: FabricRow, column: FabricColumn): number {
  switch (column) {
    case 'name':
      return a.name.localeCompare(b.name, 'en', { sensitivity: 'base', numeric: true })
    case 'color':
      return lightness(a.color) - lightness(b.color)
    case 'fatQuarter':
    case 'fatEighth':
      return Number(a[column]) - Number(b[column])
    default:
      return a[column] - b[column]
  }
}

/**
 * The rows sorted by a column (a new array; ties keep name order, then the original order).
 * Swatches sort dark to light; "no" sorts before "yes".
 *
 * @example sortFabricRows(rows, 'yards', 'descending')[0]?.name // the fabric to buy most of
 */
export function sortFabricRows(rows: readonly FabricRow[], column: FabricColumn, direction: SortDirection): FabricRow[] {
  const sign = direction === 'ascending' ? 1 : -1
  return rows
    .map((row, index) => ({ row, index }))
    .sort((a, b) => sign * compare(a.row, b.row, column) || compare(a.row, b.row, 'name') || a.index - b.index)
    .map(({ row }) => row)
}

export interface FabricTotals {
  readonly fabrics: number
  readonly pieces: number
  /** The sum of each fabric's yards (each is bought on its own, in 1/8 yd steps). */
  readonly yards: number
  /** The sum of each fabric's metres, to 0.1 m. */
  readonly metres: number
  /** Fabrics a fat quarter will do for, and a fat eighth. */
  readonly fatQuarters: number
  readonly fatEighths: number
}

/**
 * The totals row.
 *
 * @example fabricTotals([{ pieces: 3, yards: 0.25, metres: 0.3, fatQuarter: true, fatEighth: false }, …])
 */
export function fabricTotals(rows: readonly FabricRow[]): FabricTotals {
  const sum = (value: (row: FabricRow) => number): number => rows.reduce((total, row) => total + value(row), 0)
  return {
    fabrics: rows.length,
    pieces: sum((row) => row.pieces),
    // Eighths of a yard add exactly in binary floating point; metres are summed in tenths.
    yards: sum((row) => row.yards),
    metres: Math.round(sum((row) => Math.round(row.metres * 10))) / 10,
    fatQuarters: rows.filter((row) => row.fatQuarter).length,
    fatEighths: rows.filter((row) => row.fatEighth).length,
  }
}

/**
 * Yards the way a quilt shop says them: eighths reduced, as on a cutting counter's ticket.
 *
 * @example formatYards(1.25) // '1 1/4 yd'
 */
export function formatYards(yards: number): string {
  const eighths = Math.round(yards * 8)
  const whole = Math.floor(eighths / 8)
  let numerator = eighths % 8
  let denominator = 8
  while (numerator > 0 && numerator % 2 === 0) {
    numerator /= 2
    denominator /= 2
  }
  const fraction = numerator > 0 ? `${numerator}/${denominator}` : ''
  return `${whole > 0 && fraction ? `${whole} ${fraction}` : whole > 0 ? whole : fraction || '0'} yd`
}

/**
 * Metres for a metric shop, in its 10 cm steps.
 *
 * @example formatMetres(0.3) // '0.3 m'
 */
export function formatMetres(metres: number): string {
  return `${metres.toFixed(1)} m`
}

/** The cutting settings a person typed, in the design's units. */
export interface CuttingSettingsForm {
  readonly widthOfFabric: string
  readonly extraPercent: string
}

/**
 * The width of fabric (inches) and extra (percent) from the settings form, or the problem in words;
 * the ranges are the ones the cutting command and the print room check (lib/schemas/cutting-settings.ts).
 *
 * @example cuttingSettingsFrom({ widthOfFabric: '101.6', extraPercent: '10' }, 'cm') // { ok: true, widthOfFabricIn: 40, extraPercent: 10 }
 */
export function cuttingSettingsFrom(form: CuttingSettingsForm, units: LengthUnits): { ok: true; widthOfFabricIn: number; extraPercent: number } | { ok: false; message: string } {
  const width = Number(form.widthOfFabric)
  const extra = Number(form.extraPercent)
  const widthOfFabricIn = units === 'cm' ? centimetresToInches(width) : width
  const [least, most] = WIDTH_OF_FABRIC_RANGE_INCHES
  // Checked to a thousandth of an inch, so 304.8 cm is 120 in whatever the float says.
  const checked = Math.round(widthOfFabricIn * 1000) / 1000
  if (form.widthOfFabric.trim() === '' || !Number.isFinite(width) || checked < least || checked > most) {
    const range = units === 'cm' ? `${inchesToCentimetres(least).toFixed(1)} and ${inchesToCentimetres(most).toFixed(1)} cm` : `${least} and ${most} in`
    return { ok: false, message: `The usable width of fabric must be between ${range}.` }
  }
  if (form.extraPercent.trim() === '' || !Number.isFinite(extra) || extra < EXTRA_PERCENT_RANGE[0] || extra > EXTRA_PERCENT_RANGE[1]) {
    return { ok: false, message: `The extra must be between ${EXTRA_PERCENT_RANGE[0]} and ${EXTRA_PERCENT_RANGE[1]} %.` }
  }
  return { ok: true, widthOfFabricIn, extraPercent: extra }
}

/** The CSV's header row, in column order. */
export const CSV_FIELDS = ['Colourway', 'Fabric', 'Colour', 'Pieces', 'Yards', 'Metres', 'Fat quarter', 'Fat eighth'] as const

/**
 * The table as CSV (RFC 4180, written by papaparse): a header row, then a row per fabric in the
 * order given. Yards and metres are plain decimals a spreadsheet can add; a name that would start
 * a spreadsheet formula is escaped (papaparse's `escapeFormulae`).
 *
 * @example fabricCsv('Snowberry Dusk', rows) // 'Colourway,Fabric,Colour,…\r\nSnowberry Dusk,background,#eef2f5,12,0.25,0.2,yes,no\r\n…'
 */
export function fabricCsv(colorway: string, rows: readonly FabricRow[]): string {
  return Papa.unparse(
    {
      fields: [...CSV_FIELDS],
      data: rows.map((row) => [colorway, row.name, row.color ?? '', row.pieces, row.yards, row.metres, row.fatQuarter ? 'yes' : 'no', row.fatEighth ? 'yes' : 'no']),
    },
    { escapeFormulae: true, newline: '\r\n' },
  )
}

/**
 * The CSV file's name: pattern and colourway, safe on every system.
 *
 * @example fabricCsvFileName('Hollyberry Wreath', 'Snowberry Dusk') // 'hollyberry-wreath-snowberry-dusk-fabric.csv'
 */
export function fabricCsvFileName(pattern: string, colorway: string): string {
  const slug = (text: string): string => text.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '')
  return `${[slug(pattern) || 'pattern', slug(colorway), 'fabric'].filter(Boolean).join('-')}.csv`
}
