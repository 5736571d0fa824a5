/**
 * The shop's cover: the finished ring in one colourway (fabric side, as the quilt will look),
 * drawn as SVG text on the server from the geometry core's plan — the same areas, transforms and
 * outlines the booklet's cover draws (lib/booklet/cover.ts `drawRingPreview`), with no canvas.
 *
 * Repeat 0 is written once inside <defs> and placed N times with <use> and its repeat transform,
 * so a ring of 12 repeats costs about one repeat's worth of text. Coordinates are inches in the
 * design's y-up frame; one group flips y for the screen.
 */
import { outlineFromPolygon, planDesign, repeatTransforms, type AffineTransform, type Design } from '@/geometry'
import { CURL_STROKE, curveData, outlineData, polygonData, ringDrawing, svgNumber as n } from '@/lib/ring-drawing'

/** An area, leaf or berry whose fabric the colourway does not colour (lib/ring-drawing.ts). */
export { UNCOLOURED_FILL } from '@/lib/ring-drawing'
/** Seams between areas: a dark thread colour, thin against the ring. */
const SEAM_STROKE = '#5a5a5a'
/** Seam lines as a share of the ring's outer radius (about 0.06 in on a 9 in radius). */
const SEAM_WIDTH_PER_RADIUS = 1 / 150

/** Text for XML: the five characters that could end an attribute or start markup. */
const escapeXml = (text: string): string =>
  text.replace(/[&<>"']/g, (character) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[character]!)

/** SVG's matrix(a b c d e f) maps (x, y) to (a x + c y + e, b x + d y + f). */
const matrix = (t: AffineTransform): string => `matrix(${[t.xx, t.yx, t.xy, t.yy, t.tx, t.ty].map(n).join(' ')})`

export interface RingCoverOptions {
  /** The colourway by name; the design's first when absent or unknown (as the booklet picks). */
  readonly colorway?: string
  /** Prefix of the ids inside the SVG: unique among the covers of one page. */
  readonly idPrefix: string
  /** What a screen reader says for the picture. */
  readonly title: string
}

/**
 * The ring as an SVG document fragment (`<svg …>…</svg>`), square, scaled by its container.
 *
 * @example ringCoverSvg(design, { colorway: 'Holly', idPrefix: 'c1', title: 'Hollyberry Wreath in Holly' }) // '<svg xmlns=… viewBox="-9 -9 18 18" …>'
 */
export function ringCoverSvg(design: Design, options: RingCoverOptions): string {
  const colorway = design.colorways.find((candidate) => candidate.name === options.colorway) ?? design.colorways[0] ?? null
  const plan = planDesign(design, { suggestions: false })
  const drawing = ringDrawing(design, plan, colorway)
  const r = design.ring.outerRadius
  const areasId = `${options.idPrefix}-areas`
  const decorId = `${options.idPrefix}-decor`

  const areas = drawing.areas.map(
    ({ area, fill }) => `<path data-area="${escapeXml(area.label ?? area.id)}" fill="${fill}" d="${outlineData(outlineFromPolygon(area.polygon, design.ring))}"/>`,
  )
  const decorations: string[] = [
    ...drawing.leaves.map((leaf) => `<path data-leaf="${escapeXml(leaf.leafId)}" fill="${leaf.fill}" d="${polygonData(leaf.outline)}"/>`),
    ...drawing.berries.map((berry) => `<circle fill="${berry.fill}" cx="${n(berry.at[0])}" cy="${n(berry.at[1])}" r="${n(berry.radius)}"/>`),
    ...drawing.curls.map((curl) => `<path fill="none" stroke="${CURL_STROKE}" stroke-width="${n(r / 120)}" d="${curveData(curl)}"/>`),
  ]
  const stems = drawing.stems.map((stem) => `<circle fill="none" stroke="${stem.stroke}" stroke-width="${n(stem.width)}" cx="0" cy="0" r="${n(stem.radius)}"/>`)
  const transforms = repeatTransforms(design.ring)
  const place = (id: string) => transforms.map((transform) => `<use href="#${id}" transform="${matrix(transform)}"/>`).join('')
  const title = escapeXml(options.title)
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" viewBox="${n(-r)} ${n(-r)} ${n(2 * r)} ${n(2 * r)}" role="img" aria-label="${title}" data-colorway="${escapeXml(colorway?.name ?? '')}">`,
    `<title>${title}</title>`,
    `<defs><g id="${areasId}" stroke="${SEAM_STROKE}" stroke-width="${n(r * SEAM_WIDTH_PER_RADIUS)}" stroke-linejoin="round">${areas.join('')}</g>`,
    `<g id="${decorId}" stroke="#282828" stroke-width="${n(r * SEAM_WIDTH_PER_RADIUS * 0.75)}">${decorations.join('')}</g></defs>`,
    // Flip y: the design's frame points up, the screen's down.
    `<g transform="scale(1 -1)">${place(areasId)}${stems.join('')}${decorations.length > 0 ? place(decorId) : ''}</g>`,
    '</svg>',
  ].join('')
}
