/**
 * The leaves as the maker meets them in the booklet: how many folded leaves of each fabric to
 * make before sewing, and, for each leaf, where to baste it in words — over which area, how far
 * along the line from a named end, which way its tip points and its layers, bottom first. Leaves
 * are named by the one rule of `leafNames` (geometry), never by their ids.
 */
import { leafBaseOnSeam, leafLayers, PIECES_PER_FOLDED_LEAF, type Leaf, type PlanArea, type Point, type Segment } from '@/geometry'
import { formatInches } from '@/lib/units'
import { fabricName, type BookletModel } from './model'

/** A seam end this close to an outline edge or an area's boundary lies on it, inches (seam ends snap within 0.01 in). */
const ON_EDGE_INCHES = 0.02
/** A leaf tilted less than this from square to its seam is called square to it, degrees. */
const SQUARE_DEGREES = 1
/** cos 45°: a tip within 45° of the radial direction points to the outer edge or the centre. */
const RADIAL_COSINE = Math.SQRT1_2

/** One kind of folded leaf to make: its fabric, its finished size and how many for the whole ring. */
export interface LeafBatch {
  readonly fabric: string
  readonly lengthIn: number
  readonly widthIn: number
  /** Folded leaves for the whole ring (every layer of every leaf × the repeats). */
  readonly folded: number
  /** Pieces to cut: two per folded leaf. */
  readonly pieces: number
}

/** Pieces of fabric in one folded leaf: two, sewn right sides together and turned (the core's rule). */
export { PIECES_PER_FOLDED_LEAF }

/**
 * The folded leaves to make, by fabric and size, in first-seen order: each layer of a stacked leaf
 * is a folded leaf of its own, and every repeat has its own leaves.
 *
 * @example leafBatches(model)[0] // { fabric: 'leaf-dark', lengthIn: 1.75, widthIn: 0.875, folded: 8, pieces: 16 }
 */
export function leafBatches(model: BookletModel): LeafBatch[] {
  const repeats = model.design.ring.repeats
  const batches = new Map<string, { fabric: string; lengthIn: number; widthIn: number; folded: number }>()
  for (const leaf of model.design.leaves) {
    // Each layer at its own size (its offset's scale of the leaf's).
    for (const { fabric, length, width } of leafLayers(leaf)) {
      const key = `${fabric}\u0000${formatInches(length)}\u0000${formatInches(width)}`
      const batch = batches.get(key) ?? { fabric, lengthIn: length, widthIn: width, folded: 0 }
      batch.folded += repeats
      batches.set(key, batch)
    }
  }
  // Grouped by fabric (in first-seen order), larger leaves first within a fabric.
  const fabrics = [...new Set([...batches.values()].map((batch) => batch.fabric))]
  return [...batches.values()]
    .sort((a, b) => fabrics.indexOf(a.fabric) - fabrics.indexOf(b.fabric) || b.lengthIn - a.lengthIn || b.widthIn - a.widthIn)
    .map((batch) => ({ ...batch, pieces: PIECES_PER_FOLDED_LEAF * batch.folded }))
}

/**
 * A leaf's plain name ("leaf 2 of A3"), from the one naming rule.
 *
 * @example leafName(model, 'l1') // 'leaf 1 of A2'
 */
export function leafName(model: BookletModel, leafId: string): string {
  return model.leafNames.get(leafId) ?? 'leaf'
}

/**
 * The layers in words, bottom first, each by its fabric's name in the model's colourway, with its
 * size and any turn of its own (as seen on the fabric side).
 *
 * @example layersInWords(model, leaf) // 'layers bottom first: Holly green batik 1 3/4 × 7/8 in, Sage sprig print 1 5/8 × 3/4 in turned 10° counter-clockwise'
 */
export function layersInWords(model: BookletModel, leaf: Leaf): string {
  const words = leafLayers(leaf).map(({ fabric, length, width, turn }) => {
    const turned = Math.abs(turn) < SQUARE_DEGREES ? '' : ` turned ${Math.round(Math.abs(turn))}° ${turn > 0 ? 'counter-clockwise' : 'clockwise'}`
    return `${fabricName(model, fabric)} ${formatInches(length).replace(' in', '')} × ${formatInches(width)}${turned}`
  })
  return words.length > 1 ? `layers bottom first: ${words.join(', ')}` : `one layer: ${words[0] ?? ''}`
}

const distance = (a: Point, b: Point): number => Math.hypot(a[0] - b[0], a[1] - b[1])

/** Distance from a point to a segment, inches. */
function distanceToSegment(p: Point, [a, b]: Segment): number {
  const dx = b[0] - a[0]
  const dy = b[1] - a[1]
  const lengthSquared = dx * dx + dy * dy
  const t = lengthSquared > 0 ? Math.max(0, Math.min(1, ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / lengthSquared)) : 0
  return distance(p, [a[0] + t * dx, a[1] + t * dy])
}

/** End names a maker finds less readily on the foundation in hand; an end with another name is preferred. */
const VAGUE_END_NAMES = new Set(['the edge of the foundation', 'the straight side edge'])

/**
 * How the maker finds a seam end on the foundation in hand: on the ring's edges, by the areas of
 * the same section meeting there, or else at the foundation's edge.
 */
function endName(model: BookletModel, end: Point, section: string | null, skip: readonly (string | null)[]): string {
  const { ring } = model.design
  const radius = Math.hypot(end[0], end[1])
  if (radius < ON_EDGE_INCHES) return 'the centre point'
  if (Math.abs(radius - ring.outerRadius) < ON_EDGE_INCHES) return 'the outer edge'
  if (ring.innerRadius > 0 && Math.abs(radius - ring.innerRadius) < ON_EDGE_INCHES) return 'the inner edge'
  const touching = model.labelledAreas
    .filter((area) => !skip.includes(area.label))
    .filter((area) => area.polygon.some((p, i) => distanceToSegment(end, [p, area.polygon[(i + 1) % area.polygon.length]!]) < ON_EDGE_INCHES))
  const here = touching.filter((area) => area.section === section).map((area) => area.label!).sort()
  if (here.length === 1) return `the corner of ${here[0]}`
  if (here.length > 1) return `where ${here.slice(0, -1).join(', ')} and ${here[here.length - 1]} meet`
  // Another section's areas lie beyond the paper's edge: the maker sees only that edge.
  return touching.length > 0 ? 'the edge of the foundation' : 'the straight side edge'
}

/** Where a leaf sits, in the maker's words, and the facts behind them (for tests). */
export interface LeafPlace {
  readonly name: string
  readonly over: string | null
  /** The line it is basted on (the seam line the next area is sewn along), repeat 0's frame. */
  readonly line: Segment
  /** The end of that line its distance is measured from. */
  readonly fromEnd: Point
  readonly fromEndName: string
  /** From that end to the middle of the leaf's open end, inches. */
  readonly distanceIn: number
  /** "tip into A2, square to the line (toward the outer edge)". */
  readonly tip: string
  /** The whole placement in one sentence part, e.g. "over A2, the middle of its open end 2 1/4 in from the outer edge along the line, tip …". */
  readonly words: string
}

/**
 * Where a leaf lies, worded for the maker: measured along `line` (the seam line it is caught on)
 * from the end with the clearer name (the nearer end when both are clear).
 *
 * @example leafPlace(model, leaf, seam, area.sewnAlong).words // 'over A2, the middle of its open end 2 1/4 in along the line from the outer edge, tip into A2, square to the line'
 */
export function leafPlace(model: BookletModel, leaf: Leaf, line: Segment, over: PlanArea | null, catcher: PlanArea | null): LeafPlace {
  const seam = model.design.seams.find((s) => s.id === leaf.seam)
  const { base, normal } = seam ? leafBaseOnSeam(leaf, seam) : { base: line[0], normal: [0, 1] as Point }
  const skip = [over?.label ?? null, catcher?.label ?? null]
  const section = over?.section ?? catcher?.section ?? null
  const ends = line.map((end) => ({ end, name: endName(model, end, section, skip), distanceIn: distance(base, end) }))
  const [first, second] = ends as [(typeof ends)[0], (typeof ends)[0]]
  const unclear = (name: string) => VAGUE_END_NAMES.has(name)
  let chosen = first.distanceIn <= second.distanceIn ? first : second
  if (unclear(chosen.name) && !unclear((chosen === first ? second : first).name)) chosen = chosen === first ? second : first
  const other = chosen === first ? second : first
  const along = chosen.name === other.name
    ? `${formatInches(chosen.distanceIn)} from one end of the line and ${formatInches(other.distanceIn)} from the other (both ends at ${chosen.name})`
    : `${formatInches(chosen.distanceIn)} along the line from its end at ${chosen.name}`
  // The tip: into the area it lies over, square to the line or leaning toward one end.
  const tilt = (leaf.angle * Math.PI) / 180
  const axis: Point = [normal[0] * Math.cos(tilt) - normal[1] * Math.sin(tilt), normal[0] * Math.sin(tilt) + normal[1] * Math.cos(tilt)]
  const lineVector: Point = [other.end[0] - chosen.end[0], other.end[1] - chosen.end[1]]
  const leansTowardOther = axis[0] * lineVector[0] + axis[1] * lineVector[1] > 0
  const lean = Math.abs(leaf.angle) < SQUARE_DEGREES
    ? 'square to the line'
    : `leaning ${Math.round(Math.abs(leaf.angle))}° from square toward the end at ${(leansTowardOther ? other : chosen).name}`
  const radial = Math.hypot(base[0], base[1]) > 0 ? (axis[0] * base[0] + axis[1] * base[1]) / Math.hypot(base[0], base[1]) : 0
  const compass = radial > RADIAL_COSINE ? ' (toward the outer edge)' : radial < -RADIAL_COSINE ? ' (toward the centre)' : ''
  const area = over?.label ?? 'its area'
  const tip = `tip into ${area}, ${lean}${compass}`
  return {
    name: leafName(model, leaf.id),
    over: over?.label ?? null,
    line,
    fromEnd: chosen.end,
    fromEndName: chosen.name,
    distanceIn: chosen.distanceIn,
    tip,
    words: `over ${area}, the middle of its open end ${along}, ${tip}`,
  }
}
