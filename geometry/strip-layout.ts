/**
 * The cutting layout of one fabric, the way rotary cutting works (common practice, references.md):
 * the fabric lies flat, its usable width across (x, 0 at one selvedge edge) and its length along
 * (y, 0 at the cut end). Strips are cut across the whole width, one after another; each strip is
 * cut crosswise into columns; each column is cut into pieces stacked along the length, and a piece
 * narrower than its column is trimmed from the column's side. Every cut is a straight cut from
 * edge to edge of what it cuts (a guillotine cut), and a piece may be turned 90°.
 *
 * Packing: first-fit decreasing height (shelves of pieces lying flat, tallest first) is the floor.
 * The layout also builds strips one at a time, trying every strip height a remaining piece offers
 * and filling each strip column by column, every column from the width that fills it best (pieces
 * of one size stack in one column, as a maker batches them); it keeps the strip that wastes the
 * least. Two such greedy orders run beside the floor and the shortest layout wins, so the result is
 * never longer than first-fit decreasing height.
 *
 * A piece wider than the usable width whichever way it is turned cannot be cut from it: it is
 * left out and reported as a problem in plain words, never an exception.
 */
import { CUT_FIT_SLACK_INCHES } from './tolerances'

/** Pieces of one size to cut: `for` names what they are for (an area label, "leaf", "berry", …). */
export interface PieceToCut {
  readonly for: string
  readonly widthIn: number
  readonly heightIn: number
  readonly count: number
}

/** One piece placed on the fabric: x across the usable width, y along the length from the cut end. */
export interface PlacedCut {
  readonly for: string
  readonly xIn: number
  readonly yIn: number
  /** As placed: across the width. */
  readonly widthIn: number
  /** As placed: along the length. */
  readonly heightIn: number
  /** True when the piece lies turned 90° from the size it was asked for. */
  readonly turned: boolean
}

/** A strip cut across the whole usable width; its cuts lie inside it. */
export interface CuttingStrip {
  readonly yIn: number
  readonly heightIn: number
  readonly cuts: readonly PlacedCut[]
}

export interface CuttingProblem {
  readonly code: 'piece-too-wide'
  /** Plain words, naming the piece and what would do. */
  readonly message: string
  /** What the piece is for. */
  readonly for: string
}

export interface StripLayout {
  readonly widthOfFabricIn: number
  readonly strips: readonly CuttingStrip[]
  /** Every placed piece, strip by strip (the strips' cuts, flattened). */
  readonly cuts: readonly PlacedCut[]
  /** The strips' total height, inches: the length of fabric the layout takes. */
  readonly lengthIn: number
  /** Total area of the placed pieces, square inches. */
  readonly pieceAreaSqIn: number
  /** No layout is shorter than this: the pieces' area over the width (and the tallest piece's short side). */
  readonly lowerBoundIn: number
  readonly problems: readonly CuttingProblem[]
}

export interface StripLayoutOptions {
  /** Usable width of fabric, inches. */
  readonly widthOfFabricIn: number
}

/** Pieces of one size (long × short, whatever they were asked as), with what each is for. */
interface Kind {
  readonly long: number
  readonly short: number
  readonly area: number
  /** One entry per piece: its `for` and whether it was asked for long side along the length. */
  readonly asked: readonly { readonly for: string; readonly longAlong: boolean }[]
}

/** A kind in one orientation: `across` the width, `along` the length. */
interface Orientation {
  readonly across: number
  readonly along: number
  /** True when the long side lies along the length. */
  readonly longAlong: boolean
}

interface Placement {
  readonly kind: number
  readonly orientation: Orientation
  /** Offsets within the strip. */
  readonly x: number
  readonly y: number
}

interface StripPlan {
  readonly height: number
  readonly placements: readonly Placement[]
  readonly area: number
}

const fits = (size: number, room: number): boolean => size <= room + CUT_FIT_SLACK_INCHES

function orientationsOf(kind: Kind, width: number): Orientation[] {
  const result: Orientation[] = []
  if (fits(kind.long, width)) result.push({ across: kind.long, along: kind.short, longAlong: false })
  if (kind.long !== kind.short && fits(kind.short, width)) result.push({ across: kind.short, along: kind.long, longAlong: true })
  return result
}

/**
 * Stacks pieces into a column `columnWidth` across and `height` along: largest pieces first, each
 * the way round that lies widest in the column (so the most of it stack), as many as fit.
 */
function stackColumn(kinds: readonly Kind[], remaining: readonly number[], columnWidth: number, height: number, width: number, x: number): { placements: Placement[]; area: number; top: number } {
  const placements: Placement[] = []
  const taken = new Map<number, number>()
  let top = 0
  let area = 0
  for (let k = 0; k < kinds.length; k += 1) {
    const kind = kinds[k]!
    const options = orientationsOf(kind, width).filter((o) => fits(o.across, columnWidth)).sort((a, b) => b.across - a.across)
    for (const orientation of options) {
      let left = remaining[k]! - (taken.get(k) ?? 0)
      while (left > 0 && fits(top + orientation.along, height)) {
        placements.push({ kind: k, orientation, x, y: top })
        top += orientation.along
        area += kind.area
        taken.set(k, (taken.get(k) ?? 0) + 1)
        left -= 1
      }
    }
  }
  return { placements, area, top }
}

/**
 * Fills one strip of `height`: column after column, each from the width (a remaining piece's
 * side) whose stack wastes the least of its column, wider first on a tie.
 */
function fillStrip(kinds: readonly Kind[], remaining: readonly number[], height: number, width: number): StripPlan {
  const left = [...remaining]
  const placements: Placement[] = []
  let x = 0
  let area = 0
  let top = 0
  for (;;) {
    const room = width - x
    const widths = new Set<number>()
    kinds.forEach((kind, k) => {
      if (left[k]! <= 0) return
      for (const o of orientationsOf(kind, width)) if (fits(o.across, room) && fits(o.along, height)) widths.add(o.across)
    })
    let best: { column: ReturnType<typeof stackColumn>; columnWidth: number; score: number } | null = null
    for (const columnWidth of widths) {
      const column = stackColumn(kinds, left, columnWidth, height, width, x)
      if (column.placements.length === 0) continue
      const score = column.area / (columnWidth * height)
      if (!best || score > best.score + CUT_FIT_SLACK_INCHES || (Math.abs(score - best.score) <= CUT_FIT_SLACK_INCHES && columnWidth > best.columnWidth)) {
        best = { column, columnWidth, score }
      }
    }
    if (!best) break
    for (const placement of best.column.placements) left[placement.kind]! -= 1
    placements.push(...best.column.placements)
    area += best.column.area
    top = Math.max(top, best.column.top)
    x += best.columnWidth
  }
  return { height: top, placements, area }
}

/** Heights a strip can usefully have: every side of a remaining piece that can lie along the length. */
function stripHeights(kinds: readonly Kind[], remaining: readonly number[], width: number): number[] {
  const heights = new Set<number>()
  kinds.forEach((kind, k) => {
    if (remaining[k]! > 0) for (const o of orientationsOf(kind, width)) heights.add(o.along)
  })
  return [...heights].sort((a, b) => b - a)
}

type Strategy = 'least-waste' | 'tallest-first'

/**
 * Strips one at a time until every piece is placed. `least-waste` tries every height and keeps
 * the strip with the least waste per inch of length (taller on a tie); `tallest-first` cuts each
 * strip as tall as the tallest remaining piece lying flat needs, and fills it.
 */
function greedyStrips(kinds: readonly Kind[], width: number, strategy: Strategy): StripPlan[] {
  const remaining = kinds.map((kind) => kind.asked.length)
  const strips: StripPlan[] = []
  while (remaining.some((count) => count > 0)) {
    let heights = stripHeights(kinds, remaining, width)
    if (strategy === 'tallest-first') {
      const flat = kinds.flatMap((kind, k) => (remaining[k]! > 0 ? [orientationsOf(kind, width)[0]!.along] : []))
      heights = [Math.max(...flat)]
    }
    let best: StripPlan | null = null
    let bestScore = -1
    for (const height of heights) {
      const strip = fillStrip(kinds, remaining, height, width)
      if (strip.placements.length === 0) continue
      const score = strip.area / (width * strip.height)
      if (score > bestScore + CUT_FIT_SLACK_INCHES) {
        best = strip
        bestScore = score
      }
    }
    if (!best) break
    for (const placement of best.placements) remaining[placement.kind]! -= 1
    strips.push(best)
  }
  return strips
}

/** First-fit decreasing height: every piece lying flat, tallest first, on the first shelf it fits. */
function firstFitDecreasingHeight(kinds: readonly Kind[], width: number): StripPlan[] {
  const items = kinds.flatMap((kind, k) => {
    const orientation = orientationsOf(kind, width)[0]!
    return kind.asked.map(() => ({ kind: k, orientation }))
  })
  items.sort((a, b) => b.orientation.along - a.orientation.along || b.orientation.across - a.orientation.across || a.kind - b.kind)
  const shelves: { height: number; x: number; placements: Placement[]; area: number }[] = []
  for (const item of items) {
    let shelf = shelves.find((candidate) => fits(item.orientation.along, candidate.height) && fits(candidate.x + item.orientation.across, width))
    if (!shelf) {
      shelf = { height: item.orientation.along, x: 0, placements: [], area: 0 }
      shelves.push(shelf)
    }
    shelf.placements.push({ kind: item.kind, orientation: item.orientation, x: shelf.x, y: 0 })
    shelf.x += item.orientation.across
    shelf.area += kinds[item.kind]!.area
  }
  return shelves.map(({ height, placements, area }) => ({ height, placements, area }))
}

const totalHeight = (strips: readonly StripPlan[]): number => strips.reduce((sum, strip) => sum + strip.height, 0)

/**
 * Lays out pieces on fabric `widthOfFabricIn` wide in strips cut across the width (see the file
 * comment). Deterministic: the same pieces in the same order give the same layout.
 *
 * @example layoutStrips([{ for: 'A1', widthIn: 3, heightIn: 4, count: 40 }], { widthOfFabricIn: 40 }).lengthIn // 12: 4 strips 3 in tall, 10 pieces turned 4 in across in each
 */
export function layoutStrips(pieces: readonly PieceToCut[], options: StripLayoutOptions): StripLayout {
  const width = options.widthOfFabricIn
  if (!(width > 0) || !Number.isFinite(width)) throw new RangeError(`the usable width must be a positive length, got ${width}`)
  const problems: CuttingProblem[] = []
  const bySize = new Map<string, { long: number; short: number; asked: { for: string; longAlong: boolean }[] }>()
  for (const piece of pieces) {
    if (!(piece.widthIn > 0) || !(piece.heightIn > 0) || !Number.isFinite(piece.widthIn) || !Number.isFinite(piece.heightIn)) {
      throw new RangeError(`a piece's sides must be positive lengths, got ${piece.widthIn} × ${piece.heightIn} for ${piece.for}`)
    }
    if (piece.count <= 0) continue
    const long = Math.max(piece.widthIn, piece.heightIn)
    const short = Math.min(piece.widthIn, piece.heightIn)
    if (!fits(short, width)) {
      problems.push({
        code: 'piece-too-wide',
        for: piece.for,
        message: `${piece.count === 1 ? 'The piece' : `${piece.count} pieces`} ${short} × ${long} in for ${piece.for} ${piece.count === 1 ? 'is' : 'are'} wider than the usable width of ${width} in whichever way ${piece.count === 1 ? 'it is' : 'they are'} turned: cut ${piece.count === 1 ? 'it' : 'them'} from wider fabric, or piece ${piece.count === 1 ? 'it' : 'them'} from two.`,
      })
      continue
    }
    const key = `${long}×${short}`
    const entry = bySize.get(key) ?? { long, short, asked: [] }
    for (let i = 0; i < piece.count; i += 1) entry.asked.push({ for: piece.for, longAlong: piece.heightIn > piece.widthIn })
    bySize.set(key, entry)
  }
  // Largest first: columns stack the big pieces before the small ones fill the gaps.
  const kinds: Kind[] = [...bySize.values()]
    .map((entry) => ({ ...entry, area: entry.long * entry.short }))
    .sort((a, b) => b.area - a.area || b.long - a.long)
  const candidates = [
    firstFitDecreasingHeight(kinds, width),
    greedyStrips(kinds, width, 'least-waste'),
    greedyStrips(kinds, width, 'tallest-first'),
  ]
  // The shortest; the least-waste greedy, then tallest-first, before the floor on a tie.
  const order = [1, 2, 0]
  const chosen = order.map((i) => candidates[i]!).reduce((best, next) => (totalHeight(next) < totalHeight(best) - CUT_FIT_SLACK_INCHES ? next : best))
  // Hand out what each piece is for, in the order the pieces were asked for, strip by strip.
  const nextAsked = kinds.map(() => 0)
  const strips: CuttingStrip[] = []
  let y = 0
  for (const strip of chosen) {
    const cuts = [...strip.placements]
      .sort((a, b) => a.x - b.x || a.y - b.y)
      .map((placement): PlacedCut => {
        const asked = kinds[placement.kind]!.asked[nextAsked[placement.kind]!]!
        nextAsked[placement.kind]! += 1
        return {
          for: asked.for,
          xIn: placement.x,
          yIn: y + placement.y,
          widthIn: placement.orientation.across,
          heightIn: placement.orientation.along,
          turned: placement.orientation.longAlong !== asked.longAlong,
        }
      })
    strips.push({ yIn: y, heightIn: strip.height, cuts })
    y += strip.height
  }
  const pieceAreaSqIn = kinds.reduce((sum, kind) => sum + kind.area * kind.asked.length, 0)
  const tallest = kinds.reduce((most, kind) => Math.max(most, kind.asked.length > 0 ? orientationsOf(kind, width)[0]!.along : 0), 0)
  return {
    widthOfFabricIn: width,
    strips,
    cuts: strips.flatMap((strip) => strip.cuts),
    lengthIn: y,
    pieceAreaSqIn,
    lowerBoundIn: Math.max(pieceAreaSqIn / width, tallest),
    problems,
  }
}
