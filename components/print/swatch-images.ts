/**
 * The print room's swatch images: each fabric of the chosen colourway that names a swatch upload
 * is fetched from /api/uploads/<id> (the designer's own, so the session lets them read it), made
 * a small centre-cropped square and handed to the booklet. A swatch that cannot be fetched or
 * decoded is simply left out: the booklet then shows the fabric's colour chip. Browser only.
 */
import type { Colorway } from '@/geometry'
import type { SwatchImage, SwatchImages } from '@/lib/booklet/swatches'

const UPLOAD_ID = /[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}/i
/** The side of the square handed to the booklet, pixels: a 10 pt square at over 600 dpi. */
const SWATCH_PIXELS = 96

/**
 * Where a colourway fabric's swatch is served: its upload id (or the id inside an older object
 * key) at /api/uploads/<id>; null for anything else.
 *
 * @example swatchUrl('6f1c2b3a-0d4e-4f5a-8b6c-7d8e9f0a1b2c') // '/api/uploads/6f1c2b3a-0d4e-4f5a-8b6c-7d8e9f0a1b2c'
 */
export function swatchUrl(swatch: string | undefined): string | null {
  const id = swatch ? UPLOAD_ID.exec(swatch)?.[0] : undefined
  return id ? `/api/uploads/${id.toLowerCase()}` : null
}

/**
 * The swatch uploads of a colourway's fabrics, by fabric role.
 *
 * @example swatchUrls(colorway) // [['background', '/api/uploads/6f1c…']]
 */
export function swatchUrls(colorway: Colorway | null | undefined): [string, string][] {
  if (!colorway) return []
  return Object.entries(colorway.fabrics).flatMap(([fabric, chosen]) => {
    const url = swatchUrl(chosen.swatch)
    return url ? [[fabric, url] as [string, string]] : []
  })
}

/** The image made a small square JPEG, cropped to its middle; the bytes as they came where the browser cannot. */
async function smallSquare(blob: Blob): Promise<SwatchImage> {
  if (typeof createImageBitmap !== 'function' || typeof OffscreenCanvas !== 'function') return { bytes: new Uint8Array(await blob.arrayBuffer()), type: blob.type }
  const bitmap = await createImageBitmap(blob)
  try {
    const side = Math.min(bitmap.width, bitmap.height)
    const canvas = new OffscreenCanvas(SWATCH_PIXELS, SWATCH_PIXELS)
    const context = canvas.getContext('2d')
    if (!context) return { bytes: new Uint8Array(await blob.arrayBuffer()), type: blob.type }
    context.drawImage(bitmap, (bitmap.width - side) / 2, (bitmap.height - side) / 2, side, side, 0, 0, SWATCH_PIXELS, SWATCH_PIXELS)
    const square = await canvas.convertToBlob({ type: 'image/jpeg', quality: 0.9 })
    return { bytes: new Uint8Array(await square.arrayBuffer()), type: 'image/jpeg' }
  } finally {
    bitmap.close()
  }
}

/**
 * Fetches and prepares the colourway's swatches; the ones that fail are left out (and said on the
 * console, for whoever looks).
 *
 * @example const swatches = await fetchSwatchImages(colorway, controller.signal)
 */
export async function fetchSwatchImages(colorway: Colorway | null | undefined, signal?: AbortSignal): Promise<SwatchImages> {
  const entries = await Promise.all(
    swatchUrls(colorway).map(async ([fabric, url]): Promise<[string, SwatchImage] | null> => {
      try {
        const response = await fetch(url, { signal, credentials: 'same-origin' })
        if (!response.ok) throw new Error(`${response.status}`)
        return [fabric, await smallSquare(await response.blob())]
      } catch (error) {
        if (signal?.aborted) return null
        console.warn(`The swatch of ${fabric} could not be loaded (${error instanceof Error ? error.message : String(error)}); the booklet shows its colour instead.`)
        return null
      }
    }),
  )
  return Object.fromEntries(entries.filter((entry): entry is [string, SwatchImage] => entry !== null))
}
