/**
 * Pure colour helpers for the palette proposed from a theme-fabric photo (lib/images.ts): colours
 * as `#rrggbb`, a perceptual distance, dropping near-identical colours, and snapping a colour to
 * the nearest one that really occurs in the image.
 */

export type Rgb = readonly [number, number, number]

/** The colour as `#rrggbb`, each channel rounded and clamped to 0–255. @example toHex([255, 128, 0]) // '#ff8000' */
export function toHex([r, g, b]: Rgb): string {
  const channel = (value: number) => Math.min(255, Math.max(0, Math.round(value))).toString(16).padStart(2, '0')
  return `#${channel(r)}${channel(g)}${channel(b)}`
}

/** An sRGB channel (0–255) as linear light (0–1): the sRGB transfer function (IEC 61966-2-1). */
function linear(channel: number): number {
  const c = channel / 255
  return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4
}

/** The colour in OKLab (Björn Ottosson's published matrices), where distance follows perception. */
export function toOklab([r, g, b]: Rgb): [number, number, number] {
  const [lr, lg, lb] = [linear(r), linear(g), linear(b)]
  const l = Math.cbrt(0.4122214708 * lr + 0.5363325363 * lg + 0.0514459929 * lb)
  const m = Math.cbrt(0.2119034982 * lr + 0.6806995451 * lg + 0.1073969566 * lb)
  const s = Math.cbrt(0.0883024619 * lr + 0.2817188376 * lg + 0.6299787005 * lb)
  return [
    0.2104542553 * l + 0.793617785 * m - 0.0040720468 * s,
    1.9779984951 * l - 2.428592205 * m + 0.4505937099 * s,
    0.0259040371 * l + 0.7827717662 * m - 0.808675766 * s,
  ]
}

/** Euclidean distance in OKLab: 0 for the same colour, 1 from black to white. */
export function colourDistance(a: Rgb, b: Rgb): number {
  const [l1, a1, b1] = toOklab(a)
  const [l2, a2, b2] = toOklab(b)
  return Math.hypot(l1 - l2, a1 - a2, b1 - b2)
}

/**
 * Colours closer than this in OKLab count as the same for a palette. About 0.02 is where two
 * colours side by side start to look different (a "just noticeable difference", from memory);
 * twice that keeps the palette to colours a designer would tell apart as fabrics.
 */
export const NEAR_IDENTICAL = 0.04

/** The colours in order, each dropped when it is near-identical to one kept before it; at most `max`. */
export function distinctColours(colours: readonly Rgb[], max: number, threshold = NEAR_IDENTICAL): Rgb[] {
  const kept: Rgb[] = []
  for (const colour of colours) {
    if (kept.length >= max) break
    if (kept.every((other) => colourDistance(colour, other) >= threshold)) kept.push(colour)
  }
  return kept
}

/**
 * The pixel of `pixels` (RGB or RGBA bytes, `channels` per pixel) nearest to `colour` (squared RGB
 * distance, which is enough to find a colour the quantizer averaged from nearby pixels).
 */
export function nearestPixel(pixels: Uint8Array, channels: number, colour: Rgb): Rgb {
  let best: Rgb = colour
  let bestDistance = Infinity
  for (let i = 0; i + 2 < pixels.length; i += channels) {
    const dr = pixels[i]! - colour[0]
    const dg = pixels[i + 1]! - colour[1]
    const db = pixels[i + 2]! - colour[2]
    const distance = dr * dr + dg * dg + db * db
    if (distance < bestDistance) {
      bestDistance = distance
      best = [pixels[i]!, pixels[i + 1]!, pixels[i + 2]!]
      if (distance === 0) break
    }
  }
  return best
}
