/**
 * The cutting list by fabric, from the plan's rough-cut pieces, the leaves, berries, stem ring and
 * binding: what to cut, piece by piece. How much of each fabric to buy is the core's
 * `fabricRequirements` (the fabric page's "What to buy", lib/booklet/cover.ts).
 */
import { berryCutDiameterInches, leafLayers, stemStrip } from '@/geometry'
import { formatInches } from '@/lib/units'
import { bindingPlan } from './finishing'
import { leafName, PIECES_PER_FOLDED_LEAF } from './leaves'
import type { BookletModel } from './model'

/**
 * Every piece to cut, grouped by fabric, in first-seen order of fabrics.
 *
 * @example cuttingList(model).get('background') // ['8 × rectangle 3 1/4 × 2 1/2 in (A1, A3)', …]
 */
export function cuttingList(model: BookletModel): Map<string, string[]> {
  const pieces = new Map<string, Map<string, { count: number; labels: string[] }>>()
  const add = (fabric: string, what: string, count: number, label: string): void => {
    const byWhat = pieces.get(fabric) ?? new Map<string, { count: number; labels: string[] }>()
    pieces.set(fabric, byWhat)
    const entry = byWhat.get(what) ?? { count: 0, labels: [] }
    entry.count += count
    if (label && !entry.labels.includes(label)) entry.labels.push(label)
    byWhat.set(what, entry)
  }
  for (const kind of model.foundations) {
    for (const area of model.labelledAreas.filter((a) => a.section === kind.section)) {
      const long = Math.max(area.roughCut.widthIn, area.roughCut.heightIn)
      const short = Math.min(area.roughCut.widthIn, area.roughCut.heightIn)
      add(model.fabricOf.get(area.id) ?? '', `rectangle ${formatInches(long).replace(' in', '')} × ${formatInches(short)}`, kind.count, area.label ?? '')
    }
  }
  const { design } = model
  const repeats = design.ring.repeats
  // Pieces, not leaves: each folded leaf is two pieces cut with its template (8 leaves = 16 pieces).
  for (const leaf of design.leaves) {
    for (const { fabric, length, width } of leafLayers(leaf)) {
      add(fabric, `leaf piece ${formatInches(length).replace(' in', '')} × ${formatInches(width)}, cut with the leaf template of that size (${PIECES_PER_FOLDED_LEAF} per folded leaf)`, PIECES_PER_FOLDED_LEAF * repeats, leafName(model, leaf.id))
    }
  }
  for (const berry of design.berries) {
    add(berry.fabric, `circle ${formatInches(berryCutDiameterInches(berry.finishedDiameter))} across for a ${formatInches(berry.finishedDiameter)} berry`, repeats, '')
  }
  for (const stem of design.stems) {
    // Folded bias stem (geometry/bias.ts): 2πr + the joining overlap, cut 2 × finished width + 1/2 in wide.
    const strip = stemStrip(stem)
    add(stem.fabric, `bias strip ${formatInches(strip.cutWidthIn)} wide, ${formatInches(strip.lengthIn)} long in all (stem ring)`, 1, '')
  }
  // Binding: one bias strip per curved edge, each with its own joining allowance.
  const binding = bindingPlan(design)
  for (const edge of binding.edges) {
    add(binding.fabric, `bias strip ${formatInches(binding.cutWidthIn)} wide, ${formatInches(edge.stripLengthIn)} long in all (binding, ${edge.edge} edge)`, 1, '')
  }
  const result = new Map<string, string[]>()
  for (const [fabric, byWhat] of pieces) {
    result.set(fabric, [...byWhat].map(([what, { count, labels }]) => `${count} × ${what}${labels.length ? ` (${labels.join(', ')})` : ''}`))
  }
  return result
}

/**
 * All the binding for the ring's curved edges, inches: the strips of `bindingPlan`, one per edge,
 * each 2πr plus its own joining allowance, rounded up.
 *
 * @example bindingLengthInches(model) // 67 for an 18 in wedge ring: 2π × 9 + 10 = 66.5, rounded up
 */
export function bindingLengthInches(model: BookletModel): number {
  return bindingPlan(model.design).edges.reduce((sum, edge) => sum + edge.stripLengthIn, 0)
}
