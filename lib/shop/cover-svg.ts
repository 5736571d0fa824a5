/**
 * The shop's cover: the finished ring in one colourway (fabric side, as the quilt will look),
 * drawn as SVG text on the server from the geometry core's plan — the same areas, transforms and
 * outlines the booklet's cover draws (lib/booklet/cover.ts `drawRingPreview`), with no canvas.
 *
 * Repeat 0 is written once inside <defs> and placed N times with <use> and its repeat transform,
 * so a ring of 12 repeats costs about one repeat's worth of text. Coordinates are inches in the
 * design's y-up frame; one group flips y for the screen.
 */
import {
  arcSweep,
  colorwayFabric,
  fabricsOfAreas,
  outlineFromPolygon,
  planDesign,
  repeatTransforms,
  smoothCurve,
  tryPlaceLeafLayers,
  type AffineTransform,
  type Colorway,
  type Design,
  type OutlinePath,
  type Point,
  type Polygon,
  type SmoothCurve,
} from '@/geometry'

/** An area, leaf or berry whose fabric the colourway does not colour: the booklet's grey (lib/booklet/draw.ts `rgb`). */
export const UNCOLOURED_FILL = '#d2d2d2'
/** Seams between areas: a dark thread colour, thin against the ring. */
const SEAM_STROKE = '#5a5a5a'
/** Seam lines as a share of the ring's outer radius (about 0.06 in on a 9 in radius). */
const SEAM_WIDTH_PER_RADIUS = 1 / 150

/** Inches to 3 decimals (1/1000 in, far below a pixel at any card size), without trailing zeros. */
const n = (value: number): string => String(Math.round(value * 1000) / 1000)
const xy = (point: Point): string => `${n(point[0])} ${n(point[1])}`

/** Text for XML: the five characters that could end an attribute or start markup. */
const escapeXml = (text: string): string =>
  text.replace(/[&<>"']/g, (character) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[character]!)

/** A colourway's colour for a fabric role, only ever a `#rrggbb` (the design schema's rule), else the grey. */
function fillOf(colorway: Colorway | null, fabric: string | undefined): string {
  const colour = fabric === undefined ? undefined : colorwayFabric(colorway, fabric)?.color
  return colour && /^#[0-9a-fA-F]{6}$/.test(colour) ? colour.toLowerCase() : UNCOLOURED_FILL
}

/** An outline of lines and true arcs as SVG path data; SVG arcs turn the same way as ours in the y-up frame. */
function outlineData(path: OutlinePath): string {
  const parts: string[] = []
  for (const segment of path) {
    if (segment.kind === 'line') {
      if (parts.length === 0) parts.push(`M${xy(segment.from)}`)
      parts.push(`L${xy(segment.to)}`)
    } else {
      const at = (angle: number): Point => [segment.center[0] + segment.radius * Math.cos(angle), segment.center[1] + segment.radius * Math.sin(angle)]
      if (parts.length === 0) parts.push(`M${xy(at(segment.startAngle))}`)
      const largeArc = arcSweep(segment) > Math.PI ? 1 : 0
      const sweep = segment.anticlockwise ? 1 : 0
      parts.push(`A${n(segment.radius)} ${n(segment.radius)} 0 ${largeArc} ${sweep} ${xy(at(segment.endAngle))}`)
    }
  }
  return `${parts.join('')}Z`
}

const polygonData = (polygon: Polygon): string => `M${polygon.map(xy).join('L')}Z`

const curveData = (curve: SmoothCurve): string =>
  `M${xy(curve.start)}${curve.pieces.map(([c1, c2, end]) => `C${xy(c1)} ${xy(c2)} ${xy(end)}`).join('')}`

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
  const plan = planDesign(design)
  const fabricOf = fabricsOfAreas(design.fills, plan.areas)
  const r = design.ring.outerRadius
  const areasId = `${options.idPrefix}-areas`
  const decorId = `${options.idPrefix}-decor`

  const areas = plan.areas.map(
    (area) => `<path data-area="${escapeXml(area.label ?? area.id)}" fill="${fillOf(colorway, fabricOf.get(area.id))}" d="${outlineData(outlineFromPolygon(area.polygon, design.ring))}"/>`,
  )
  const decorations: string[] = []
  for (const leaf of design.leaves) {
    const seam = design.seams.find((candidate) => candidate.id === leaf.seam)
    const placed = seam ? tryPlaceLeafLayers(leaf, seam) : null
    // An impossible leaf is the plan's problem to report; the cover leaves it out, as the booklet does.
    if (!placed?.ok) continue
    for (const layer of placed.layers) decorations.push(`<path data-leaf="${escapeXml(leaf.id)}" fill="${fillOf(colorway, layer.fabric)}" d="${polygonData(layer.placement.finishedOutline)}"/>`)
  }
  for (const berry of design.berries) {
    decorations.push(`<circle fill="${fillOf(colorway, berry.fabric)}" cx="${n(berry.at[0])}" cy="${n(berry.at[1])}" r="${n(berry.finishedDiameter / 2)}"/>`)
  }
  for (const curl of design.curls) {
    decorations.push(`<path fill="none" stroke="#32281e" stroke-width="${n(r / 120)}" d="${curveData(smoothCurve(curl.points))}"/>`)
  }
  const stems = design.stems.map(
    (stem) => `<circle fill="none" stroke="${fillOf(colorway, stem.fabric)}" stroke-width="${n(stem.finishedWidth)}" cx="0" cy="0" r="${n(stem.radius)}"/>`,
  )
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
