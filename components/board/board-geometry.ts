/**
 * Shapes of the board in design units, computed from the design and its plan for drawing:
 * repeat 0 and every other repeat of the ring, leaves as they lie, fabric colours per area.
 */
import { applyTransform, repeatTransforms, type AffineTransform, type Point } from '@/geometry'
import { tryPlaceLeafLayers } from '@/geometry/leaf-template'
import type { BoardPlan } from '@/lib/board/board-plan'
import type { BoardDesign } from '@/lib/board/commands'

/** The one point type (geometry/types.ts), re-exported for the canvas components. */
export type { Point }

export interface AreaShape {
  readonly id: string
  readonly label: string | null
  readonly polygon: readonly Point[]
  readonly labelAt: Point
  readonly fabric: string | null
}

export interface LeafShape {
  readonly id: string
  /** Outlines of the stacked layers, bottom first, each turned and sized by its offset so all show. */
  readonly layers: readonly { readonly outline: readonly Point[]; readonly fabric: string }[]
}

/** The plan's areas in design units (converted once, by boardPlan), each with the fabric of the last fill that falls in it. */
export function areaShapes(plan: BoardPlan): AreaShape[] {
  return plan.areas.map(({ id, label, polygon, labelAt, fabric }) => ({ id, label, polygon, labelAt, fabric }))
}

/**
 * Each leaf as it lies on its seam, every stacked layer with its own turn and size (the
 * geometry the booklet prints: `tryPlaceLeafLayers`), bottom first, so every layer shows.
 */
export function leafShapes(design: BoardDesign): LeafShape[] {
  const shapes: LeafShape[] = []
  for (const leaf of design.leaves) {
    const seam = design.seams.find((s) => s.id === leaf.seam)
    if (!seam) continue
    // A leaf too wide for its length cannot be pointed: the plan reports it, the board skips it.
    const placed = tryPlaceLeafLayers({ ...leaf, angle: leaf.angle ?? 0 }, seam)
    if (!placed.ok) continue
    shapes.push({ id: leaf.id, layers: placed.layers.map((layer) => ({ fabric: layer.fabric, outline: layer.placement.finishedOutline })) })
  }
  return shapes
}

/** The transforms from repeat 0 to every repeat of the ring (rotations, or reflections in mirror mode). */
export function ringTransforms(design: BoardDesign): AffineTransform[] {
  return repeatTransforms({ ...design.ring })
}

export const transformPoints = (transform: AffineTransform, points: readonly Point[]): Point[] =>
  points.map((p) => applyTransform(transform, p))

/** The outline of repeat 0 as a polygon (arcs as short chords), in design units. */
export function repeatOutlinePolygon(design: BoardDesign, segmentsPerArc = 48): Point[] {
  const { innerRadius, outerRadius, repeats } = design.ring
  const sweep = (2 * Math.PI) / repeats
  const outer: Point[] = []
  for (let i = 0; i <= segmentsPerArc; i += 1) {
    const angle = (sweep * i) / segmentsPerArc
    outer.push([outerRadius * Math.cos(angle), outerRadius * Math.sin(angle)])
  }
  if (innerRadius === 0) return [[0, 0], ...outer]
  const inner: Point[] = []
  for (let i = segmentsPerArc; i >= 0; i -= 1) {
    const angle = (sweep * i) / segmentsPerArc
    inner.push([innerRadius * Math.cos(angle), innerRadius * Math.sin(angle)])
  }
  return [...outer, ...inner]
}
