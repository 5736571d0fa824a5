import 'server-only'
import { getPalette } from 'colorthief'
import { fileTypeFromBuffer } from 'file-type'
import sharp from 'sharp'
import { ServiceError } from '@/lib/errors'
import { distinctColours, nearestPixel, toHex, type Rgb } from '@/lib/palette'
import { IMAGE_TYPES, type ImageType } from '@/models/upload'

/**
 * Uploaded images, checked and remade on the server before anything is stored: the type is read
 * from the bytes (never the file name or the Content-Type header), the image decoded in full (a
 * truncated or damaged file is refused), turned upright, resized to fit MAX_IMAGE_SIDE and
 * re-encoded in its own type, which drops its metadata (EXIF with camera and place, comments).
 */

/** The largest upload, in bytes: 10 MB (10 × 1024 × 1024), enough for a phone photo of a fabric. */
export const MAX_UPLOAD_BYTES = 10 * 1024 * 1024
/** The longest side of a stored image, in pixels: sharp enough to judge a print, small to serve. */
export const MAX_IMAGE_SIDE = 1600
/**
 * The longest side of a stored shop cover, in pixels: the shop's cards show a cover at most about
 * 320 CSS pixels wide and a pattern's page about 480, so 960 is sharp at twice the density of the
 * screen (common practice for "retina" screens) while a page of twelve cards stays light. Stored at
 * this size when uploaded, so no page resizes an image per request.
 */
export const MAX_COVER_SIDE = 960
/**
 * The most pixels decoded, checked from the header before decoding: a small file can announce a
 * huge image (a "decompression bomb"). 50 megapixels is well above any phone camera's photo.
 */
export const MAX_INPUT_PIXELS = 50_000_000
/** Colours proposed from a theme-fabric photo: 6 to 8 when the photo has that many distinct ones. */
export const PALETTE_SIZE = 8

const TYPE_NAMES: Record<ImageType, string> = { 'image/jpeg': 'JPEG', 'image/png': 'PNG', 'image/webp': 'WebP' }
const SHARP_FORMATS: Record<ImageType, string> = { 'image/jpeg': 'jpeg', 'image/png': 'png', 'image/webp': 'webp' }
const ACCEPTED = 'Send a JPEG, PNG or WebP image.'

function isImageType(mime: string): mime is ImageType {
  return (IMAGE_TYPES as readonly string[]).includes(mime)
}

/** The image type the bytes are, or 415 naming what they are instead. */
export async function sniffImageType(bytes: Uint8Array, declaredType: string | null): Promise<ImageType> {
  if (bytes.byteLength === 0) throw new ServiceError(`The file is empty. ${ACCEPTED}`, 415)
  const found = await fileTypeFromBuffer(bytes)
  if (found && isImageType(found.mime)) return found.mime
  const declared = declaredType?.split(';')[0]?.trim().toLowerCase() ?? ''
  if (found) throw new ServiceError(`The file is a ${found.ext.toUpperCase()} file (${found.mime}), not a JPEG, PNG or WebP image. ${ACCEPTED}`, 415)
  if (declared.startsWith('image/')) {
    throw new ServiceError(`The file was sent as an image (${declared}), but its contents are not a JPEG, PNG or WebP image. ${ACCEPTED}`, 415)
  }
  throw new ServiceError(`The file is not a JPEG, PNG or WebP image. ${ACCEPTED}`, 415)
}

export interface PreparedImage {
  readonly bytes: Uint8Array
  readonly contentType: ImageType
  readonly width: number
  readonly height: number
}

/** The image decoded, upright, fitted in `maxSide` (MAX_IMAGE_SIDE unless told) and re-encoded without metadata; 422 if it does not decode. */
export async function prepareImage(bytes: Uint8Array, contentType: ImageType, maxSide: number = MAX_IMAGE_SIDE): Promise<PreparedImage> {
  const name = TYPE_NAMES[contentType]
  // failOn 'error': a truncated or corrupt image is refused, a harmless warning is not.
  const input = () => sharp(bytes, { failOn: 'error', limitInputPixels: MAX_INPUT_PIXELS })
  let width: number | undefined
  let height: number | undefined
  try {
    ;({ width, height } = await input().metadata())
  } catch {
    throw new ServiceError(`The ${name} image could not be read: it looks damaged or cut short. Try saving or exporting it again.`, 422)
  }
  if (!width || !height) throw new ServiceError(`The ${name} image has no size: it looks damaged. Try saving or exporting it again.`, 422)
  if (width * height > MAX_INPUT_PIXELS) {
    throw new ServiceError(`The image is ${width} × ${height} pixels; at most ${MAX_INPUT_PIXELS / 1_000_000} megapixels are accepted. Make it smaller first.`, 422)
  }
  const pipeline = input()
    .rotate()
    .resize({ width: maxSide, height: maxSide, fit: 'inside', withoutEnlargement: true })
  const encoded =
    contentType === 'image/jpeg'
      ? pipeline.jpeg({ quality: 85, mozjpeg: true })
      : contentType === 'image/png'
        ? pipeline.png({ compressionLevel: 8 })
        : pipeline.webp({ quality: 85 })
  try {
    const { data, info } = await encoded.toBuffer({ resolveWithObject: true })
    if (info.format !== SHARP_FORMATS[contentType]) throw new Error(`encoded as ${info.format}`)
    return { bytes: new Uint8Array(data), contentType, width: info.width, height: info.height }
  } catch {
    throw new ServiceError(`The ${name} image could not be read: it looks damaged or cut short. Try saving or exporting it again.`, 422)
  }
}

/**
 * Up to PALETTE_SIZE colours of the image, most common first, as `#rrggbb`: the quantizer's
 * colours, each moved to the nearest colour that occurs in the image (a quantizer averages), then
 * near-identical ones dropped.
 */
export async function proposePalette(image: PreparedImage): Promise<string[]> {
  const colours = (await getPalette(Buffer.from(image.bytes), { colorCount: 16, quality: 4, colorSpace: 'rgb', ignoreWhite: false })) ?? []
  const { data, info } = await sharp(image.bytes).removeAlpha().raw().toBuffer({ resolveWithObject: true })
  const pixels = new Uint8Array(data.buffer, data.byteOffset, data.byteLength)
  const snapped = colours.map((colour) => nearestPixel(pixels, info.channels, colour.array() as Rgb))
  return distinctColours(snapped, PALETTE_SIZE).map(toHex)
}
