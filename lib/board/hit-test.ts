/**
 * What lies under the pointer on the board, found in the ring's frame (inches) rather than by the
 * canvas, so the same answer serves the mouse, the keyboard and the tests.
 */
import { isPointInPolygon, type Point } from '@/geometry'
import { tryPlaceLeafLayers } from '@/geometry/leaf-template'
import { sampleSmoothCurve, smoothCurve } from '@/geometry/smooth-curve'
import type { BoardDesign } from './commands'

export type Hit =
  | { readonly kind: 'seam-end'; readonly seamId: string; readonly end: 'from' | 'to' }
  | { readonly kind: 'leaf'; readonly leafId: string }
  | { readonly kind: 'berry'; readonly index: number }
  | { readonly kind: 'seam'; readonly seamId: string; readonly fraction: number; readonly side: 'left' | 'right' }
  | { readonly kind: 'curl'; readonly index: number }
  | null

const distance = (a: Point, b: Point) => Math.hypot(a[0] - b[0], a[1] - b[1])

/** The distance from p to segment ab, the fraction along it, and the side p lies on. */
export function projectOntoSeam(p: Point, a: Point, b: Point) {
  const dx = b[0] - a[0]
  const dy = b[1] - a[1]
  const lengthSquared = dx * dx + dy * dy
  const t = lengthSquared === 0 ? 0 : Math.max(0, Math.min(1, ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / lengthSquared))
  const closest: Point = [a[0] + t * dx, a[1] + t * dy]
  const cross = dx * (p[1] - a[1]) - dy * (p[0] - a[0])
  return { distance: distance(p, closest), fraction: t, side: cross >= 0 ? ('left' as const) : ('right' as const) }
}

/**
 * The thing under a point of the design (in the design's units), preferring small handles to
 * large shapes: seam ends, then leaves and berries, then seams and curls.
 */
export function hitTest(design: BoardDesign, point: Point, tolerance: number): Hit {
  let bestEnd: { seamId: string; end: 'from' | 'to'; gap: number } | null = null
  for (const seam of design.seams) {
    for (const end of ['from', 'to'] as const) {
      const gap = distance(seam[end], point)
      if (gap <= tolerance && (!bestEnd || gap < bestEnd.gap)) bestEnd = { seamId: seam.id, end, gap }
    }
  }
  if (bestEnd) return { kind: 'seam-end', seamId: bestEnd.seamId, end: bestEnd.end }

  for (const leaf of [...design.leaves].reverse()) {
    const seam = design.seams.find((s) => s.id === leaf.seam)
    if (!seam) continue
    // A leaf too wide for its length has no outline to hit (the plan reports it).
    // Any layer of the stack picks the leaf: a turned layer can reach past the bottom one.
    const placed = tryPlaceLeafLayers({ ...leaf, angle: leaf.angle ?? 0 }, seam)
    if (placed.ok && placed.layers.some((layer) => isPointInPolygon(point, layer.placement.finishedOutline))) return { kind: 'leaf', leafId: leaf.id }
  }
  for (let index = design.berries.length - 1; index >= 0; index -= 1) {
    const berry = design.berries[index]!
    if (distance(berry.at, point) <= Math.max(berry.finishedDiameter / 2, tolerance)) return { kind: 'berry', index }
  }

  let bestSeam: { seamId: string; fraction: number; side: 'left' | 'right'; gap: number } | null = null
  for (const seam of design.seams) {
    const projection = projectOntoSeam(point, seam.from, seam.to)
    if (projection.distance <= tolerance && (!bestSeam || projection.distance < bestSeam.gap)) {
      bestSeam = { seamId: seam.id, fraction: projection.fraction, side: projection.side, gap: projection.distance }
    }
  }
  if (bestSeam) return { kind: 'seam', seamId: bestSeam.seamId, fraction: bestSeam.fraction, side: bestSeam.side }

  for (let index = design.curls.length - 1; index >= 0; index -= 1) {
    // Along the curve as drawn, not the straight lines between the clicked points.
    const points = sampleSmoothCurve(smoothCurve(design.curls[index]!.points))
    for (let i = 1; i < points.length; i += 1) {
      if (projectOntoSeam(point, points[i - 1]!, points[i]!).distance <= tolerance) return { kind: 'curl', index }
    }
  }
  return null
}
