/**
 * Swatch images in the booklet: the caller hands in, per fabric role, the image a colourway's
 * fabric names as its swatch (the print room fetches them in the browser; the command line and
 * other Node callers pass none). Each is drawn as a small square beside the fabric's colour chip
 * wherever a fabric is named with its colour. An image that is missing, of another type or
 * unreadable is left out: the colour chip alone stands for the fabric, and the booklet is built
 * all the same. Pure: no file or network access.
 */
import type { jsPDF } from 'jspdf'
import { rgb, solidPen } from './draw'

/** A swatch image as its bytes and declared type, or as a `data:` URL. */
export type SwatchImage =
  | { readonly bytes: Uint8Array; readonly type: string }
  | { readonly dataUrl: string }

/** Swatch images by fabric role. */
export type SwatchImages = Readonly<Record<string, SwatchImage>>

type ImageFormat = 'JPEG' | 'PNG' | 'WEBP'

/** A swatch read and ready to draw: the bytes, what they are, and the image's size in pixels. */
export interface ReadySwatch {
  readonly alias: string
  readonly bytes: Uint8Array
  readonly format: ImageFormat
  readonly width: number
  readonly height: number
}

/** The side of a swatch square and of the colour chip's height, points. */
export const SWATCH_SIZE_PT = 10
/** The colour chip's width, points. */
const CHIP_WIDTH_PT = 14
/** Room between the chip, the swatch and the name, points. */
const GAP_PT = 4

const TYPES: Readonly<Record<string, ImageFormat>> = { 'image/jpeg': 'JPEG', 'image/png': 'PNG', 'image/webp': 'WEBP' }

/**
 * What the bytes are, from their first bytes (JPEG SOI marker, the PNG signature, a RIFF file of
 * form WEBP), never from the declared type; null for anything else.
 *
 * @example sniffSwatch(new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) // 'PNG'
 */
export function sniffSwatch(bytes: Uint8Array): ImageFormat | null {
  const starts = (offset: number, ...values: number[]): boolean => values.every((value, index) => bytes[offset + index] === value)
  if (starts(0, 0xff, 0xd8, 0xff)) return 'JPEG'
  if (starts(0, 0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a)) return 'PNG'
  if (starts(0, 0x52, 0x49, 0x46, 0x46) && starts(8, 0x57, 0x45, 0x42, 0x50)) return 'WEBP'
  return null
}

/** The bytes and declared type of a swatch; null for a `data:` URL that is not base64 image data. */
function bytesOf(image: SwatchImage): { bytes: Uint8Array; type: string } | null {
  if ('bytes' in image) return image.bytes instanceof Uint8Array ? image : null
  const match = /^data:([\w/+.-]+);base64,([A-Za-z0-9+/=\s]*)$/.exec(typeof image.dataUrl === 'string' ? image.dataUrl : '')
  if (!match) return null
  try {
    const binary = atob(match[2]!.replace(/\s+/g, ''))
    return { bytes: Uint8Array.from(binary, (char) => char.charCodeAt(0)), type: match[1]! }
  } catch {
    return null
  }
}

/**
 * Reads each swatch once: its type sniffed from the bytes (a declared JPEG, PNG or WebP type must
 * agree), its size read by jsPDF. Roles whose image cannot be read are left out.
 *
 * @example readSwatches(doc, { background: { bytes: png, type: 'image/png' } }).get('background')?.format // 'PNG'
 */
export function readSwatches(doc: jsPDF, images: SwatchImages | undefined): ReadonlyMap<string, ReadySwatch> {
  const ready = new Map<string, ReadySwatch>()
  if (!images) return ready
  let count = 0
  for (const [fabric, image] of Object.entries(images)) {
    const read = image ? bytesOf(image) : null
    if (!read || read.bytes.byteLength === 0) continue
    const format = sniffSwatch(read.bytes)
    const declared = TYPES[read.type.toLowerCase()]
    if (!format || (declared && declared !== format)) continue
    try {
      const properties = doc.getImageProperties(read.bytes)
      if (!(properties.width > 0 && properties.height > 0)) continue
      ready.set(fabric, { alias: `swatch-${(count += 1)}`, bytes: read.bytes, format, width: properties.width, height: properties.height })
    } catch {
      // Unreadable: the colour chip stands alone.
    }
  }
  return ready
}

/**
 * Draws a fabric's mark with its top left at (x, y): the colour chip (grey without a colour), and
 * the swatch image beside it as a square, centre-cropped and outlined, when there is one that
 * draws. Returns the x where the fabric's name starts.
 *
 * @example const nameAt = drawFabricMark(doc, '#f4ecd8', swatches.get('background'), flow.left, flow.y)
 */
export function drawFabricMark(doc: jsPDF, color: string | undefined, swatch: ReadySwatch | undefined, x: number, y: number): number {
  doc.setFillColor(...rgb(color))
  solidPen(doc, 0.4)
  doc.rect(x, y, CHIP_WIDTH_PT, SWATCH_SIZE_PT, 'FD')
  const after = x + CHIP_WIDTH_PT + GAP_PT + 2
  if (!swatch || !drawSwatch(doc, swatch, after - 2, y)) return after
  return after - 2 + SWATCH_SIZE_PT + GAP_PT + 2
}

/** The swatch as a square at (x, y), cropped to its middle; false when jsPDF could not draw it. */
function drawSwatch(doc: jsPDF, swatch: ReadySwatch, x: number, y: number): boolean {
  const side = SWATCH_SIZE_PT
  const scale = side / Math.min(swatch.width, swatch.height)
  const width = swatch.width * scale
  const height = swatch.height * scale
  doc.saveGraphicsState()
  try {
    // Clip to the square, then cover it with the image (its middle shows).
    doc.rect(x, y, side, side, null)
    doc.clip()
    doc.discardPath()
    doc.addImage(swatch.bytes, swatch.format, x - (width - side) / 2, y - (height - side) / 2, width, height, swatch.alias)
  } catch {
    return false
  } finally {
    doc.restoreGraphicsState()
  }
  solidPen(doc, 0.4)
  doc.rect(x, y, side, side, 'S')
  return true
}
