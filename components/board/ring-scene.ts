/**
 * The ring drawn in one pass on a canvas: every repeat's areas in their fabrics, the seams, the
 * appliqué and the leaves. Hundreds of shapes as one canvas path each frame is far cheaper than
 * as hundreds of scene nodes, which matters while a seam end is dragged.
 */
import type { BoardPlan } from '@/lib/board/board-plan'
import type { BoardDesign } from '@/lib/board/commands'
import type { View } from '@/lib/board/store'
import { toScreen } from '@/lib/board/view'
import { mapSmoothCurve, smoothCurve, type SmoothCurve } from '@/geometry/smooth-curve'
import { areaShapes, leafShapes, repeatOutlinePolygon, ringTransforms, transformPoints, type Point } from './board-geometry'

const UNFILLED = '#ffffff'
const SEAM = '#3b3127'
const UNKNOWN_FABRIC = '#bbbbbb'
/** Repeats other than repeat 0 are drawn paler, so the one being edited stands out. */
export const OTHER_REPEATS_OPACITY = 0.55

interface Filled {
  readonly points: readonly Point[]
  readonly colour: string
}

interface RepeatScene {
  readonly opacity: number
  readonly outline: readonly Point[]
  readonly areas: readonly Filled[]
  readonly seams: readonly (readonly [Point, Point])[]
  readonly leaves: readonly Filled[]
  /** Each curl's smooth curve (the one the booklet prints), placed in this repeat. */
  readonly curls: readonly SmoothCurve[]
  readonly berries: readonly { readonly at: Point; readonly radius: number; readonly colour: string }[]
}

export interface RingScene {
  readonly repeats: readonly RepeatScene[]
  readonly stems: readonly { readonly radius: number; readonly width: number; readonly colour: string }[]
}

/** Everything to draw, in design units, with every repeat placed by its transform. */
export function ringScene(design: BoardDesign, plan: BoardPlan, colours: Readonly<Record<string, string>>): RingScene {
  const colourOf = (fabric: string | null) => (fabric ? colours[fabric] ?? UNKNOWN_FABRIC : UNFILLED)
  const areas = areaShapes(plan)
  const leaves = leafShapes(design)
  const outline = repeatOutlinePolygon(design)
  const curls = design.curls.map((curl) => smoothCurve(curl.points))
  return {
    repeats: ringTransforms(design).map((transform, k) => ({
      opacity: k === 0 ? 1 : OTHER_REPEATS_OPACITY,
      outline: transformPoints(transform, outline),
      areas: areas.map((area) => ({ points: transformPoints(transform, area.polygon), colour: colourOf(area.fabric) })),
      seams: design.seams.map((seam) => transformPoints(transform, [seam.from, seam.to]) as unknown as [Point, Point]),
      leaves: leaves.flatMap((leaf) => leaf.layers.map((layer) => ({ points: transformPoints(transform, layer.outline), colour: colourOf(layer.fabric) }))),
      curls: curls.map((curve) => mapSmoothCurve(curve, (p) => transformPoints(transform, [p])[0]!)),
      berries: design.berries.map((berry) => ({
        at: transformPoints(transform, [berry.at])[0]!,
        radius: berry.finishedDiameter / 2,
        colour: colourOf(berry.fabric),
      })),
    })),
    stems: design.stems.map((stem) => ({ radius: stem.radius, width: stem.finishedWidth, colour: colourOf(stem.fabric) })),
  }
}

function tracePolygon(context: CanvasRenderingContext2D, points: readonly Point[], view: View, repeats: number): void {
  points.forEach((point, index) => {
    const [x, y] = toScreen(point, view, repeats)
    if (index === 0) context.moveTo(x, y)
    else context.lineTo(x, y)
  })
  context.closePath()
}

/** Draws the scene onto a canvas context in screen pixels. */
export function drawRingScene(context: CanvasRenderingContext2D, scene: RingScene, view: View, repeats: number): void {
  const firstRepeat = scene.repeats[0]
  // Pale repeats first, repeat 0 last, so its seams are never hidden under a neighbour's fill.
  for (const repeat of [...scene.repeats.slice(1), ...(firstRepeat ? [firstRepeat] : [])]) {
    const bold = repeat.opacity === 1
    context.globalAlpha = repeat.opacity
    context.beginPath()
    tracePolygon(context, repeat.outline, view, repeats)
    context.fillStyle = UNFILLED
    context.fill()
    for (const area of repeat.areas) {
      context.beginPath()
      tracePolygon(context, area.points, view, repeats)
      context.fillStyle = area.colour
      context.fill()
    }
    context.strokeStyle = SEAM
    context.lineWidth = bold ? 1.5 : 0.75
    for (const area of repeat.areas) {
      context.beginPath()
      tracePolygon(context, area.points, view, repeats)
      context.stroke()
    }
    context.lineWidth = bold ? 2 : 1
    context.beginPath()
    tracePolygon(context, repeat.outline, view, repeats)
    for (const [from, to] of repeat.seams) {
      const [x0, y0] = toScreen(from, view, repeats)
      const [x1, y1] = toScreen(to, view, repeats)
      context.moveTo(x0, y0)
      context.lineTo(x1, y1)
    }
    context.stroke()
  }
  context.globalAlpha = 0.9
  const [cx, cy] = toScreen([0, 0], view, repeats)
  for (const stem of scene.stems) {
    context.beginPath()
    context.arc(cx, cy, stem.radius * view.zoom, 0, 2 * Math.PI)
    context.strokeStyle = stem.colour
    context.lineWidth = Math.max(2, stem.width * view.zoom)
    context.stroke()
  }
  for (const repeat of scene.repeats) {
    context.globalAlpha = repeat.opacity
    context.strokeStyle = '#1f2a1f'
    context.lineWidth = 0.75
    for (const leaf of repeat.leaves) {
      context.beginPath()
      tracePolygon(context, leaf.points, view, repeats)
      context.fillStyle = leaf.colour
      context.fill()
      context.stroke()
    }
    context.strokeStyle = '#4a3a2a'
    context.lineWidth = 1.5
    context.setLineDash([4, 3])
    for (const curl of repeat.curls) {
      context.beginPath()
      traceSmoothCurve(context, mapSmoothCurve(curl, (p) => toScreen(p, view, repeats)))
      context.stroke()
    }
    context.setLineDash([])
    for (const berry of repeat.berries) {
      const [x, y] = toScreen(berry.at, view, repeats)
      context.beginPath()
      context.arc(x, y, berry.radius * view.zoom, 0, 2 * Math.PI)
      context.fillStyle = berry.colour
      context.fill()
      context.strokeStyle = '#2b1d14'
      context.stroke()
    }
  }
  context.globalAlpha = 1
}

/**
 * Adds a curl's curve (geometry's smooth curve, already in screen pixels) to the canvas path, as
 * an embroidered stem is stitched: the designer gives a few points, the thread follows a curve
 * through them. The booklet draws the same Bézier pieces.
 */
export function traceSmoothCurve(context: Pick<CanvasRenderingContext2D, 'moveTo' | 'bezierCurveTo'>, curve: SmoothCurve): void {
  if (curve.pieces.length === 0) return
  context.moveTo(curve.start[0], curve.start[1])
  for (const [c1, c2, end] of curve.pieces) context.bezierCurveTo(c1[0], c1[1], c2[0], c2[1], end[0], end[1])
}
