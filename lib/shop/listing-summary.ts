/**
 * What the shop's list shows of a design's colourways, kept in columns beside the pattern
 * (migration 20261202-0130, written on every save by models/pattern.ts like lib/design-summary.ts)
 * so that listing, searching and filtering never read the designs themselves.
 */
import { colourFamiliesOf, type ColourFamily } from './colour-families'

/** A colourway as the shop's card shows it: its name and its fabrics' colours as small swatches. */
export interface ColorwaySwatches {
  readonly name: string
  /** Distinct `#rrggbb` colours, lower case, lightest first (`byLightness`). */
  readonly colours: readonly string[]
}

export interface ListingSummary {
  readonly colorwaySwatches: ColorwaySwatches[]
  /** Every family one of the colourways' fabrics falls into (lib/shop/colour-families.ts). */
  readonly colourFamilies: ColourFamily[]
}

/**
 * Lightest first, by luma (ITU-R BT.601 weights 0.299, 0.587, 0.114, common practice), then by
 * text: the same order whatever order the fabrics were listed in. (PostgreSQL's JSONB keeps an
 * object's keys in an order of its own, so the order of a design's roles is not the designer's
 * once stored; a save and the migration's backfill must still agree.)
 */
function byLightness(a: string, b: string): number {
  const luma = (hex: string) => 299 * parseInt(hex.slice(1, 3), 16) + 587 * parseInt(hex.slice(3, 5), 16) + 114 * parseInt(hex.slice(5, 7), 16)
  return luma(b) - luma(a) || a.localeCompare(b)
}

const isRecord = (value: unknown): value is Record<string, unknown> => typeof value === 'object' && value !== null && !Array.isArray(value)

/**
 * The listing summary of a stored design file. Reads the JSON defensively, as designSummary does:
 * what cannot be read is left out rather than failing a save.
 *
 * @example listingSummary({ colorways: [{ name: 'Holly', fabrics: { leaf: { name: 'Holly green', color: '#2F5540' }, ground: { name: 'Cream', color: '#f4ecd8' } } }] }) // { colorwaySwatches: [{ name: 'Holly', colours: ['#f4ecd8', '#2f5540'] }], colourFamilies: ['greens', 'neutrals'] }
 */
export function listingSummary(design: unknown): ListingSummary {
  const colorways = isRecord(design) && Array.isArray(design.colorways) ? design.colorways : []
  const colorwaySwatches: ColorwaySwatches[] = []
  for (const colorway of colorways) {
    if (!isRecord(colorway) || typeof colorway.name !== 'string' || !isRecord(colorway.fabrics)) continue
    const colours = new Set<string>()
    for (const fabric of Object.values(colorway.fabrics)) {
      if (isRecord(fabric) && typeof fabric.color === 'string' && /^#[0-9a-fA-F]{6}$/.test(fabric.color)) colours.add(fabric.color.toLowerCase())
    }
    colorwaySwatches.push({ name: colorway.name, colours: [...colours].sort(byLightness) })
  }
  return { colorwaySwatches, colourFamilies: colourFamiliesOf(colorwaySwatches.flatMap((colorway) => colorway.colours)) }
}
