/**
 * The finished ring as drawing data, without a canvas: each area of repeat 0 with its fabric's
 * colour, the leaves (every stacked layer) and berries and curls of repeat 0, and the stem rings,
 * in one colourway; and SVG path text for them. The shop's cover (lib/shop/cover-svg.ts) and the
 * sewing room's picture (lib/sewing-room/picture.ts) both draw from here, so the two show the
 * same ring the booklet's cover does.
 *
 * Coordinates are inches in the design's frame (y up) unless a caller maps them (the sewing room
 * flips y for the screen before writing paths).
 */
import {
  arcSweep, colorwayFabric, fabricsOfAreas, smoothCurve, tryPlaceLeafLayers,
  type Colorway, type Design, type OutlinePath, type Plan, type PlanArea, type Point, type Polygon, type SmoothCurve,
} from '@/geometry'

/** An area, leaf or berry whose fabric the colourway does not colour: the booklet's grey (lib/booklet/draw.ts `rgb`). */
export const UNCOLOURED_FILL = '#d2d2d2'
/** The ink of embroidered curls: a dark thread. */
export const CURL_STROKE = '#32281e'

/**
 * A colourway's colour for a fabric role, only ever a lower-case `#rrggbb` (the design schema's
 * rule), else the grey.
 *
 * @example fabricFill({ name: 'Holly', fabrics: { stem: { name: 'Bark', color: '#4A3A2A' } } }, 'stem') // '#4a3a2a'
 */
export function fabricFill(colorway: Colorway | null, fabric: string | undefined): string {
  const colour = fabric === undefined ? undefined : colorwayFabric(colorway, fabric)?.color
  return colour && /^#[0-9a-fA-F]{6}$/.test(colour) ? colour.toLowerCase() : UNCOLOURED_FILL
}

/**
 * Inches to 3 decimals (1/1000 in, far below a pixel at any size), without trailing zeros.
 *
 * @example svgNumber(1.23456) // '1.235'
 */
export const svgNumber = (value: number): string => String(Math.round(value * 1000) / 1000)
const xy = (point: Point): string => `${svgNumber(point[0])} ${svgNumber(point[1])}`

/** An outline of lines and true arcs as SVG path data; SVG arcs turn the same way as ours in the y-up frame. */
export function outlineData(path: OutlinePath): string {
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
      parts.push(`A${svgNumber(segment.radius)} ${svgNumber(segment.radius)} 0 ${largeArc} ${sweep} ${xy(at(segment.endAngle))}`)
    }
  }
  return `${parts.join('')}Z`
}

/**
 * A closed polygon as SVG path data.
 *
 * @example polygonData([[0, 0], [1, 0], [0, 1]]) // 'M0 0L1 0L0 1Z'
 */
export const polygonData = (polygon: Polygon): string => `M${polygon.map(xy).join('L')}Z`

/** A smooth curve (Bézier pieces) as open SVG path data. */
export const curveData = (curve: SmoothCurve): string =>
  `M${xy(curve.start)}${curve.pieces.map(([c1, c2, end]) => `C${xy(c1)} ${xy(c2)} ${xy(end)}`).join('')}`

/**
 * A full circle as SVG path data (two half arcs), for a stroke or a fill.
 *
 * @example circleData([0, 0], 2) // 'M2 0A2 2 0 1 0 -2 0A2 2 0 1 0 2 0Z'
 */
export const circleData = (centre: Point, radius: number): string => {
  const [x, y] = centre
  const r = svgNumber(radius)
  return `M${xy([x + radius, y])}A${r} ${r} 0 1 0 ${xy([x - radius, y])}A${r} ${r} 0 1 0 ${xy([x + radius, y])}Z`
}

/** Repeat 0 of the ring, ready to draw in one colourway. */
export interface RingDrawing {
  readonly areas: readonly { readonly area: PlanArea; readonly fill: string }[]
  /** Every placed layer of every leaf, bottom first (a leaf that cannot be placed is left out, as the booklet leaves it out). */
  readonly leaves: readonly { readonly leafId: string; readonly outline: Polygon; readonly fill: string }[]
  readonly berries: readonly { readonly at: Point; readonly radius: number; readonly fill: string }[]
  readonly curls: readonly SmoothCurve[]
  /** Stem rings round the centre (the same for every repeat). */
  readonly stems: readonly { readonly radius: number; readonly width: number; readonly stroke: string }[]
}

/**
 * Repeat 0 of a planned design in a colourway: areas with their fabric colours, leaves, berries,
 * curls, and the stem rings.
 *
 * @example ringDrawing(design, planDesign(design), design.colorways[0] ?? null).areas.length // the plan's areas
 */
export function ringDrawing(design: Design, plan: Plan, colorway: Colorway | null): RingDrawing {
  const fabricOf = fabricsOfAreas(design.fills, plan.areas)
  const leaves: { leafId: string; outline: Polygon; fill: string }[] = []
  for (const leaf of design.leaves) {
    const seam = design.seams.find((candidate) => candidate.id === leaf.seam)
    const placed = seam ? tryPlaceLeafLayers(leaf, seam) : null
    // An impossible leaf is the plan's problem to report; drawings leave it out, as the booklet does.
    if (!placed?.ok) continue
    for (const layer of placed.layers) leaves.push({ leafId: leaf.id, outline: layer.placement.finishedOutline, fill: fabricFill(colorway, layer.fabric) })
  }
  return {
    areas: plan.areas.map((area) => ({ area, fill: fabricFill(colorway, fabricOf.get(area.id)) })),
    leaves,
    berries: design.berries.map((berry) => ({ at: berry.at, radius: berry.finishedDiameter / 2, fill: fabricFill(colorway, berry.fabric) })),
    curls: design.curls.map((curl) => smoothCurve(curl.points)),
    stems: design.stems.map((stem) => ({ radius: stem.radius, width: stem.finishedWidth, stroke: fabricFill(colorway, stem.fabric) })),
  }
}
