/**
 * The shop's colour families: a small set of hue families a quilter filters listings by
 * ("show me wreaths with greens"). Each colourway fabric's `#rrggbb` falls into exactly one
 * family by the one rule below; a pattern belongs to every family one of its colourways' fabrics
 * falls into (lib/shop/listing-summary.ts keeps that list beside the pattern).
 *
 * The rule is our own, tuned so that fabric colours land where a quilter would look for them:
 * creams, greys and near-blacks are neutrals; dark or muted oranges are browns; very light reds
 * are pinks. It works on hue, saturation and value (HSV, common practice) because those match the
 * words people use for colours more closely than red, green and blue do.
 */

/** The families, in the order the shop's filter lists them. */
export const COLOUR_FAMILIES = ['reds', 'oranges', 'yellows', 'greens', 'blues', 'purples', 'pinks', 'browns', 'neutrals'] as const
export type ColourFamily = (typeof COLOUR_FAMILIES)[number]

/** What the shop's filter says for each family. */
export const COLOUR_FAMILY_NAMES: Readonly<Record<ColourFamily, string>> = {
  reds: 'Reds',
  oranges: 'Oranges',
  yellows: 'Yellows',
  greens: 'Greens',
  blues: 'Blues',
  purples: 'Purples',
  pinks: 'Pinks',
  browns: 'Browns',
  neutrals: 'Neutrals (cream, grey, black, white)',
}

// The thresholds, each with its reason. Saturation, value and chroma are 0–1; hue is degrees.
/** Below this value a colour reads as black whatever its hue (a near-black navy is sold as black). */
const NEAR_BLACK_VALUE = 0.12
/** Below this chroma (max − min channel) a colour reads as grey at any lightness. */
const GREY_CHROMA = 0.06
/** Below this saturation (chroma ÷ value) a colour is a tinted neutral: cream, ivory, linen, beige. */
const NEUTRAL_SATURATION = 0.2
/** Hues from orange-red to yellow-orange turn brown when dark or muted. */
const BROWN_HUES: readonly [number, number] = [12, 50]
/** …dark: below this value (saddle brown 0.55, sienna 0.63 are brown; orange 1.0 is not). */
const BROWN_VALUE = 0.65
/** …or muted and not bright: tan (saturation 0.33, value 0.82) is brown; peach (value 1.0) stays orange. */
const BROWN_MUTED_SATURATION = 0.45
const BROWN_MUTED_VALUE = 0.9
/** A red hue this light (HSL lightness) is pink: pink 0.88 and light pink are; crimson 0.47 is red. */
const PINK_LIGHTNESS = 0.75
/** Where each hue family starts, degrees; reds wrap around 0. */
const HUE_STARTS: readonly (readonly [number, ColourFamily])[] = [
  [12, 'oranges'],
  [40, 'yellows'],
  [70, 'greens'],
  // Teal and turquoise count as blues: quilters shelve them with the blues.
  [165, 'blues'],
  [255, 'purples'],
  [305, 'pinks'],
  [345, 'reds'],
]

/**
 * The hue (degrees, 0–360), saturation and value (0–1) of a `#rrggbb` colour, with its chroma and
 * HSL lightness; null when the text is not such a colour.
 */
function hsv(hex: string): { hue: number; saturation: number; value: number; chroma: number; lightness: number } | null {
  if (!/^#[0-9a-fA-F]{6}$/.test(hex)) return null
  const [r, g, b] = [1, 3, 5].map((at) => parseInt(hex.slice(at, at + 2), 16) / 255) as [number, number, number]
  const max = Math.max(r, g, b)
  const min = Math.min(r, g, b)
  const chroma = max - min
  let hue = 0
  if (chroma > 0) {
    if (max === r) hue = 60 * (((g - b) / chroma + 6) % 6)
    else if (max === g) hue = 60 * ((b - r) / chroma + 2)
    else hue = 60 * ((r - g) / chroma + 4)
  }
  return { hue, saturation: max === 0 ? 0 : chroma / max, value: max, chroma, lightness: (max + min) / 2 }
}

/**
 * The family a fabric colour belongs to; null for text that is not `#rrggbb`.
 *
 * @example colourFamily('#2f5540') // 'greens'
 */
export function colourFamily(hex: string): ColourFamily | null {
  const colour = hsv(hex)
  if (!colour) return null
  const { hue, saturation, value, chroma, lightness } = colour
  if (value < NEAR_BLACK_VALUE || chroma < GREY_CHROMA || saturation < NEUTRAL_SATURATION) return 'neutrals'
  const [brownFrom, brownTo] = BROWN_HUES
  if (hue >= brownFrom && hue < brownTo && (value < BROWN_VALUE || (saturation < BROWN_MUTED_SATURATION && value < BROWN_MUTED_VALUE))) return 'browns'
  let family: ColourFamily = 'reds'
  for (const [start, name] of HUE_STARTS) if (hue >= start) family = name
  if (family === 'reds' && lightness > PINK_LIGHTNESS) return 'pinks'
  return family
}

/**
 * The families of a set of colours, each once, in COLOUR_FAMILIES' order.
 *
 * @example colourFamiliesOf(['#f4ecd8', '#2f5540', '#9b2915']) // ['reds', 'greens', 'neutrals']
 */
export function colourFamiliesOf(colours: Iterable<string>): ColourFamily[] {
  const found = new Set<ColourFamily>()
  for (const colour of colours) {
    const family = colourFamily(colour)
    if (family) found.add(family)
  }
  return COLOUR_FAMILIES.filter((family) => found.has(family))
}
