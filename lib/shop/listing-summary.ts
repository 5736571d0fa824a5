/**
 * What the shop's list shows of a design's colourways, kept in columns beside the pattern
 * (migration 20261202-0130, written on every save by models/pattern.ts like lib/design-summary.ts)
 * so that listing, searching and filtering never read the designs themselves.
 */
import { colourFamiliesOf, type ColourFamily } from './colour-families'

/** A colourway as the shop's card shows it: its name and its fabrics' colours as small swatches. */
export interface ColorwaySwatches {
  readonly name: string
  /** Distinct `#rrggbb` colours, lower case, in the order the colourway lists its fabrics. */
  readonly colours: readonly string[]
}

export interface ListingSummary {
  readonly colorwaySwatches: ColorwaySwatches[]
  /** Every family one of the colourways' fabrics falls into (lib/shop/colour-families.ts). */
  readonly colourFamilies: ColourFamily[]
}

const isRecord = (value: unknown): value is Record<string, unknown> => typeof value === 'object' && value !== null && !Array.isArray(value)

/**
 * The listing summary of a stored design file. Reads the JSON defensively, as designSummary does:
 * what cannot be read is left out rather than failing a save.
 *
 * @example listingSummary({ colorways: [{ name: 'Holly', fabrics: { leaf: { name: 'Holly green', color: '#2F5540' } } }] }) // { colorwaySwatches: [{ name: 'Holly', colours: ['#2f5540'] }], colourFamilies: ['greens'] }
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
    colorwaySwatches.push({ name: colorway.name, colours: [...colours] })
  }
  return { colorwaySwatches, colourFamilies: colourFamiliesOf(colorwaySwatches.flatMap((colorway) => colorway.colours)) }
}
