/**
 * Setting seam pieces aside before the faces are traced: pieces outside the outline, dangling
 * pieces (an end touching nothing) and floating pieces (a closed shape touching neither the
 * outline nor the other seams). Each is reported once, with its place, in plain words.
 */
import { comparePoints, distanceToBoundary, isPointInPolygon } from './polygon-measure'
import { ON_SEGMENT_INCHES } from './tolerances'
import type { Point, Polygon, Problem } from './types'

/** A piece of seam or outline between two vertices of the arrangement. */
export type Piece = { from: number; to: number; seamIds: string[]; onOutline: boolean }

const at = (p: Point): string => `(${p[0].toFixed(2)}, ${p[1].toFixed(2)})`

/**
 * Drops seam pieces outside the outline, reporting each seam once where it leaves.
 *
 * @example dropOutside(pieces, vertices, onOutline, outline.polygon, problems) // pieces inside the repeat
 */
export function dropOutside(pieces: Piece[], vertices: readonly Point[], onOutline: readonly boolean[], polygon: Polygon, problems: Problem[]): Piece[] {
  const reported = new Set<string>()
  return pieces.filter((piece) => {
    if (piece.onOutline) return true
    const a = vertices[piece.from] as Point
    const b = vertices[piece.to] as Point
    const middle: Point = [(a[0] + b[0]) / 2, (a[1] + b[1]) / 2]
    if (isPointInPolygon(middle, polygon) || distanceToBoundary(middle, polygon) <= ON_SEGMENT_INCHES) return true
    for (const seamId of piece.seamIds) {
      if (reported.has(seamId)) continue
      reported.add(seamId)
      const place = onOutline[piece.from] ? a : onOutline[piece.to] ? b : middle
      problems.push({ code: 'seam-outside', severity: 'error', message: `Seam ${seamId} leaves the repeat at ${at(place)}; seams must stay inside the outline.`, at: place })
    }
    return false
  })
}

function degrees(pieces: readonly Piece[], vertexCount: number): number[] {
  const degree = new Array<number>(vertexCount).fill(0)
  for (const piece of pieces) {
    degree[piece.from] = (degree[piece.from] as number) + 1
    degree[piece.to] = (degree[piece.to] as number) + 1
  }
  return degree
}

/**
 * Drops pieces with an end touching nothing, repeatedly, reporting the first loose ends.
 *
 * @example dropDangling(pieces, vertices, onOutline, problems) // no piece left with a loose end
 */
export function dropDangling(pieces: Piece[], vertices: readonly Point[], onOutline: readonly boolean[], problems: Problem[]): Piece[] {
  let kept = pieces
  let first = true
  for (;;) {
    const degree = degrees(kept, vertices.length)
    const loose = (id: number): boolean => degree[id] === 1 && !onOutline[id]
    const dangling = kept.filter((piece) => loose(piece.from) || loose(piece.to))
    if (dangling.length === 0) return kept
    if (first) {
      for (const piece of dangling) {
        for (const id of [piece.from, piece.to].filter(loose)) {
          const place = vertices[id] as Point
          problems.push({
            code: 'dangling-seam-end',
            severity: 'error',
            message: `Seam ${piece.seamIds.join(', ')} ends at ${at(place)} without touching the outline or another seam, so the area there is not closed.`,
            at: place,
          })
        }
      }
      first = false
    }
    kept = kept.filter((piece) => !dangling.includes(piece))
  }
}

/**
 * Drops pieces not connected to the outline, reporting them as one closed shape.
 *
 * @example dropFloating(pieces, vertices, onOutline, problems) // only pieces connected to the outline
 */
export function dropFloating(pieces: Piece[], vertices: readonly Point[], onOutline: readonly boolean[], problems: Problem[]): Piece[] {
  const neighbours = vertices.map((): number[] => [])
  for (const piece of pieces) {
    neighbours[piece.from]?.push(piece.to)
    neighbours[piece.to]?.push(piece.from)
  }
  const reached = vertices.map(() => false)
  const stack = vertices.map((_, id) => id).filter((id) => onOutline[id])
  for (const id of stack) reached[id] = true
  while (stack.length > 0) {
    const id = stack.pop() as number
    for (const next of neighbours[id] ?? []) {
      if (!reached[next]) {
        reached[next] = true
        stack.push(next)
      }
    }
  }
  const floating = pieces.filter((piece) => !reached[piece.from])
  if (floating.length > 0) {
    const place = floating.map((piece) => vertices[piece.from] as Point).sort(comparePoints)[0] as Point
    const ids = [...new Set(floating.flatMap((piece) => piece.seamIds))].sort()
    problems.push({
      code: 'floating-seams',
      severity: 'error',
      message: `Seams ${ids.join(', ')} form a closed shape near ${at(place)} that touches neither the outline nor the other seams; the area around it would have a hole.`,
      at: place,
    })
  }
  return pieces.filter((piece) => reached[piece.from])
}
