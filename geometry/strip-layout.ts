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
 * least, or (a second order) the strip that leaves the least for first-fit decreasing height to cut
 * after it; a third cuts each strip as tall as the tallest piece left. The three greedy orders run
 * beside the floor and the shortest layout wins, so the result is never longer than first-fit
 * decreasing height.
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
  /** The ways it lies within the width, widest across first (lying flat, when it can). */
  readonly orientations: readonly Orientation[]
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

function orientationsOf(long: number, short: number, width: number): Orientation[] {
  const result: Orientation[] = []
  if (fits(long, width)) result.push({ across: long, along: short, longAlong: false })
  if (long !== short && fits(short, width)) result.push({ across: short, along: long, longAlong: true })
  return result
}

/** Pieces of one kind and orientation stacked in a column. */
interface Run {
  readonly kind: number
  readonly orientation: Orientation
  readonly count: number
}

/**
 * Stacks pieces into a column `columnWidth` across and `height` along: largest pieces first, each
 * the way round that lies widest in the column (so the most of it stack), as many as fit. Counts
 * only; `placeColumn` turns the chosen column into placements.
 */
function stackColumn(kinds: readonly Kind[], remaining: readonly number[], columnWidth: number, height: number): { runs: Run[]; area: number; top: number } {
  const runs: Run[] = []
  let top = 0
  let area = 0
  for (let k = 0; k < kinds.length; k += 1) {
    let left = remaining[k]!
    if (left <= 0) continue
    const kind = kinds[k]!
    for (const orientation of kind.orientations) {
      if (left <= 0 || !fits(orientation.across, columnWidth)) continue
      const count = Math.min(left, Math.floor((height - top + CUT_FIT_SLACK_INCHES) / orientation.along))
      if (count <= 0) continue
      runs.push({ kind: k, orientation, count })
      top += count * orientation.along
      area += count * kind.area
      left -= count
    }
  }
  return { runs, area, top }
}

function placeColumn(runs: readonly Run[], x: number): Placement[] {
  const placements: Placement[] = []
  let y = 0
  for (const run of runs) {
    for (let i = 0; i < run.count; i += 1) {
      placements.push({ kind: run.kind, orientation: run.orientation, x, y })
      y += run.orientation.along
    }
  }
  return placements
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
      for (const o of kind.orientations) if (fits(o.across, room) && fits(o.along, height)) widths.add(o.across)
    })
    let best: { column: ReturnType<typeof stackColumn>; columnWidth: number; score: number } | null = null
    for (const columnWidth of widths) {
      const column = stackColumn(kinds, left, columnWidth, height)
      if (column.runs.length === 0) continue
      const score = column.area / (columnWidth * height)
      if (!best || score > best.score + CUT_FIT_SLACK_INCHES || (Math.abs(score - best.score) <= CUT_FIT_SLACK_INCHES && columnWidth > best.columnWidth)) {
        best = { column, columnWidth, score }
      }
    }
    if (!best) break
    for (const run of best.column.runs) left[run.kind]! -= run.count
    placements.push(...placeColumn(best.column.runs, x))
    area += best.column.area
    top = Math.max(top, best.column.top)
    x += best.columnWidth
  }
  return { height: top, placements, area }
}

/** Heights a strip can usefully have: every side of a remaining piece that can lie along the length. */
function stripHeights(kinds: readonly Kind[], remaining: readonly number[]): number[] {
  const heights = new Set<number>()
  kinds.forEach((kind, k) => {
    if (remaining[k]! > 0) for (const o of kind.orientations) heights.add(o.along)
  })
  return [...heights].sort((a, b) => b - a)
}

type Strategy = 'least-waste' | 'look-ahead' | 'tallest-first'

/**
 * Strips one at a time until every piece is placed. `least-waste` tries every height and keeps
 * the strip with the least waste per inch of length (taller on a tie); `look-ahead` tries every
 * height too, but keeps the strip whose height plus first-fit decreasing height's length for the
 * pieces it leaves is least (so a last strip that takes everything left, turned, beats one that
 * leaves a single piece for a strip of its own); `tallest-first` cuts each strip as tall as the
 * tallest remaining piece lying flat needs, and fills it.
 */
function greedyStrips(kinds: readonly Kind[], width: number, strategy: Strategy): StripPlan[] {
  const remaining = kinds.map((kind) => kind.asked.length)
  const strips: StripPlan[] = []
  while (remaining.some((count) => count > 0)) {
    let heights = stripHeights(kinds, remaining)
    if (strategy === 'tallest-first') {
      const flat = kinds.flatMap((kind, k) => (remaining[k]! > 0 ? [kind.orientations[0]!.along] : []))
      heights = [Math.max(...flat)]
    }
    let best: StripPlan | null = null
    let bestScore = -1
    let bestLength = Number.POSITIVE_INFINITY
    for (const height of heights) {
      const strip = fillStrip(kinds, remaining, height, width)
      if (strip.placements.length === 0) continue
      const score = strip.area / (width * strip.height)
      let length = 0
      if (strategy === 'look-ahead') {
        const left = [...remaining]
        for (const placement of strip.placements) left[placement.kind]! -= 1
        length = strip.height + firstFitDecreasingLength(kinds, width, left)
      }
      if (length < bestLength - CUT_FIT_SLACK_INCHES || (length <= bestLength + CUT_FIT_SLACK_INCHES && score > bestScore + CUT_FIT_SLACK_INCHES)) {
        best = strip
        bestScore = score
        bestLength = length
      }
    }
    if (!best) break
    for (const placement of best.placements) remaining[placement.kind]! -= 1
    strips.push(best)
  }
  return strips
}

const totalHeight = (strips: readonly StripPlan[]): number => strips.reduce((sum, strip) => sum + strip.height, 0)

interface Shelf {
  readonly height: number
  x: number
  area: number
  readonly runs: (Run & { readonly x: number })[]
}

/**
 * First-fit decreasing height: every piece lying flat, tallest first, on the first shelf it fits.
 * Pieces of one kind go as runs (a shelf takes as many as have room at once), which is the same
 * as placing them one by one, since a shelf too full for one is too full for the next.
 */
function firstFitDecreasingShelves(kinds: readonly Kind[], width: number, counts: readonly number[]): Shelf[] {
  const order = kinds.map((kind, k) => ({ k, orientation: kind.orientations[0]! }))
    .sort((a, b) => b.orientation.along - a.orientation.along || b.orientation.across - a.orientation.across || a.k - b.k)
  const shelves: Shelf[] = []
  for (const { k, orientation } of order) {
    let left = Math.max(0, counts[k]!)
    const take = (shelf: Shelf): void => {
      const count = Math.min(left, Math.floor((width - shelf.x + CUT_FIT_SLACK_INCHES) / orientation.across))
      if (count <= 0) return
      shelf.runs.push({ kind: k, orientation, count, x: shelf.x })
      shelf.x += count * orientation.across
      shelf.area += count * kinds[k]!.area
      left -= count
    }
    for (const shelf of shelves) {
      if (left <= 0) break
      if (fits(orientation.along, shelf.height)) take(shelf)
    }
    while (left > 0) {
      const shelf: Shelf = { height: orientation.along, x: 0, area: 0, runs: [] }
      shelves.push(shelf)
      take(shelf)
    }
  }
  return shelves
}

/** The length first-fit decreasing height takes for `counts` pieces of each kind. */
const firstFitDecreasingLength = (kinds: readonly Kind[], width: number, counts: readonly number[]): number =>
  firstFitDecreasingShelves(kinds, width, counts).reduce((sum, shelf) => sum + shelf.height, 0)

/** First-fit decreasing height as strips of placed pieces. */
function firstFitDecreasingHeight(kinds: readonly Kind[], width: number): StripPlan[] {
  return firstFitDecreasingShelves(kinds, width, kinds.map((kind) => kind.asked.length)).map((shelf) => ({
    height: shelf.height,
    area: shelf.area,
    placements: shelf.runs.flatMap((run) => Array.from({ length: run.count }, (_, i): Placement => ({ kind: run.kind, orientation: run.orientation, x: run.x + i * run.orientation.across, y: 0 }))),
  }))
}

/** Pieces merged by size (long × short), largest first; a piece too wide either way becomes a problem instead. */
function kindsOf(pieces: readonly PieceToCut[], width: number, problems: CuttingProblem[]): Kind[] {
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
  return [...bySize.values()]
    .map((entry) => ({ ...entry, area: entry.long * entry.short, orientations: orientationsOf(entry.long, entry.short, width) }))
    .sort((a, b) => b.area - a.area || b.long - a.long)
}

/**
 * The length first-fit decreasing height alone takes (the floor the layout never exceeds), for the
 * bench's comparison; pieces too wide are left out.
 *
 * @example firstFitDecreasingHeightInches([{ for: 'A1', widthIn: 3, heightIn: 4, count: 40 }], { widthOfFabricIn: 40 }) // 12
 */
export function firstFitDecreasingHeightInches(pieces: readonly PieceToCut[], options: StripLayoutOptions): number {
  const kinds = kindsOf(pieces, options.widthOfFabricIn, [])
  return firstFitDecreasingLength(kinds, options.widthOfFabricIn, kinds.map((kind) => kind.asked.length))
}

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
  const kinds = kindsOf(pieces, width, problems)
  const candidates = [
    firstFitDecreasingHeight(kinds, width),
    greedyStrips(kinds, width, 'least-waste'),
    greedyStrips(kinds, width, 'look-ahead'),
    greedyStrips(kinds, width, 'tallest-first'),
  ]
  // The shortest; on a tie the least-waste greedy, then look-ahead, then tallest-first, then the floor.
  const order = [1, 2, 3, 0]
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
  const tallest = kinds.reduce((most, kind) => Math.max(most, kind.asked.length > 0 ? kind.orientations[0]!.along : 0), 0)
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
