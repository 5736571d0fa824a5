/**
 * The sewing room's checklist: the whole job of one pattern, in one colourway at one finished
 * size, as steps grouped the way the work happens — prepare the leaves (per fabric), cut (per
 * fabric, from the cutting layout), each repeat's foundations (every area in sewing order with
 * the leaves to baste before it, then trimming each section), joining the sections, joining the
 * repeats, finishing (only what the design has).
 *
 * Pure and deterministic: the same design and options give the same steps with the same ids, so
 * progress stored by step id survives reading the checklist again. It reads the same model the
 * booklet prints from (lib/booklet/model.ts: the design scaled to the chosen diameter, its plan,
 * the colourway, the fabric requirements and leaf names), so the checklist and the booklet agree.
 */
import {
  berryCutDiameterInches, leafPieceInches, stemSewing, stemStrip, type CuttingStrip, type PlanArea, type Point, type Segment,
} from '@/geometry'
import { bindingPlan } from '@/geometry/bias'
import { leafBatches, layersInWords, leafPlace } from '@/lib/booklet/leaves'
import { bookletModel, bookletRequirements, fabricName, leavesInBooklet, sectionAreas, type BookletModel } from '@/lib/booklet/model'
import { bookletOptionsSchema } from '@/lib/schemas/booklet'
import type { ChecklistGroup, ChecklistStep } from '@/lib/schemas/sewing-room'
import { formatInches } from '@/lib/units'
import { joinCatching, sectionBeyondLeaf, sectionJoins } from './joins'

/** What a project is made in: the colourway by its index in the design, and the finished diameter. */
export interface ChecklistOptions {
  /** Index into `design.colorways`; out of range means no colourway (fabrics named by role). */
  readonly colorway: number
  readonly diameterIn: number
}

export interface Checklist {
  readonly groups: readonly ChecklistGroup[]
  readonly steps: readonly ChecklistStep[]
}

/** A corner this close to a seam's line lies on it, inches (as the booklet's step diagrams decide). */
const SEAM_LINE_INCHES = 0.01

/** Short cautions of the trade, in our words, placed on the step where each matters. */
export const STEP_CAUTIONS = {
  cutter: 'Caution: rotary blades are very sharp; close the cutter whenever you put it down and cut away from yourself.',
  iron: 'Caution: the iron gets hot enough to burn; keep its cord clear and switch it off when you step away.',
  inserts: 'Caution: folded leaves are small inserts that can come loose; a quilt with them is not for an infant.',
  berries: 'Caution: stuffed berries are small parts a young child could choke on; leave them off a quilt for an infant.',
} as const

/**
 * The design scaled and planned for a project (the booklet's model; paper plays no part in it).
 *
 * @example sewingModel(design, { colorway: 0, diameterIn: 24 }).design.ring.outerRadius // 12
 */
export function sewingModel(design: Parameters<typeof bookletModel>[0], options: ChecklistOptions): BookletModel {
  const colorway = design.colorways[options.colorway]
  return bookletModel(design, bookletOptionsSchema.parse({ paper: 'letter', finishedDiameterInches: options.diameterIn, ...(colorway ? { colorway: colorway.name } : {}) }))
}

/** 2.375 → '2 3/8' (inches without the unit, for "a × b in"). */
const bare = (inches: number): string => formatInches(inches).replace(' in', '')
const size = (widthIn: number, heightIn: number): string => `${bare(widthIn)} × ${formatInches(heightIn)}`
const plural = (count: number, one: string, many = `${one}s`): string => `${count} ${count === 1 ? one : many}`

/** Whether an earlier area has an edge along the line an area is sewn on (more than a point of it). */
function sharesLine(earlier: PlanArea, [from, to]: Segment): boolean {
  const length = Math.hypot(to[0] - from[0], to[1] - from[1])
  if (!(length > 0)) return false
  const along: Point = [(to[0] - from[0]) / length, (to[1] - from[1]) / length]
  const offLine = (p: Point) => Math.abs((p[0] - from[0]) * along[1] - (p[1] - from[1]) * along[0])
  const position = (p: Point) => (p[0] - from[0]) * along[0] + (p[1] - from[1]) * along[1]
  return earlier.polygon.some((a, index) => {
    const b = earlier.polygon[(index + 1) % earlier.polygon.length]!
    if (offLine(a) >= SEAM_LINE_INCHES || offLine(b) >= SEAM_LINE_INCHES) return false
    const low = Math.max(0, Math.min(position(a), position(b)))
    const high = Math.min(length, Math.max(position(a), position(b)))
    return high - low > SEAM_LINE_INCHES
  })
}

/** "A1", "A1 and A2", "A1, A2 and A3". */
function listWords(items: readonly string[]): string {
  if (items.length <= 1) return items[0] ?? ''
  return `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`
}

/** Whether repeat k (from 1) of the ring is sewn from the mirrored foundations. */
export function isMirroredRepeat(model: BookletModel, repeat: number): boolean {
  return model.design.ring.repeatMode === 'mirror' && repeat % 2 === 0
}

function leafPreparation(model: BookletModel): ChecklistStep[] {
  const batches = leafBatches(model)
  const fabrics = [...new Set(batches.map((batch) => batch.fabric))]
  return fabrics.map((fabric, index) => {
    const ofFabric = batches.filter((batch) => batch.fabric === fabric)
    const folded = ofFabric.reduce((sum, batch) => sum + batch.folded, 0)
    const sizes = ofFabric.map((batch) => `${batch.folded} at ${size(batch.lengthIn, batch.widthIn)} (${batch.pieces} pieces)`)
    const pieces = ofFabric.length === 1 ? leafPieceInches(ofFabric[0]!.lengthIn, ofFabric[0]!.widthIn) : null
    const instruction = [
      `Make ${plural(folded, 'folded leaf', 'folded leaves')} of ${fabricName(model, fabric)}: ${sizes.join('; ')}.`,
      'For each, lay two pieces right sides together, trace the leaf template\u2019s solid sew line, sew on it leaving the open end open, cut on the dashed cut line, clip the tip, turn right side out, push out the point and press.',
      'Batch them: cut all, sew all, then turn and press all.',
      ...(index === 0 ? [STEP_CAUTIONS.inserts] : []),
    ].join(' ')
    return {
      id: `leaves:${fabric}`,
      group: 'prepare-leaves',
      label: `Fold ${plural(folded, 'leaf', 'leaves')} from ${fabricName(model, fabric)}`,
      instruction,
      roughCut: pieces,
      repeat: null,
      areas: [],
    }
  })
}

/** What a piece of the cutting layout is for, in words. */
function pieceWords(what: string): string {
  if (what === 'leaf') return 'leaf pieces'
  if (what === 'berry') return 'berry squares'
  if (what === 'stem') return 'square for the stem\u2019s bias strip'
  if (what === 'binding') return 'square for the binding\u2019s bias strip'
  return what
}

function stripWords(strip: CuttingStrip, index: number): string {
  const kinds = new Map<string, { what: string; widthIn: number; heightIn: number; count: number }>()
  for (const cut of strip.cuts) {
    const key = `${cut.for}\u0000${cut.widthIn}\u0000${cut.heightIn}`
    const entry = kinds.get(key) ?? { what: cut.for, widthIn: cut.widthIn, heightIn: cut.heightIn, count: 0 }
    entry.count += 1
    kinds.set(key, entry)
  }
  const pieces = [...kinds.values()].map((kind) => `${kind.count} × ${pieceWords(kind.what)} ${size(kind.widthIn, kind.heightIn)}`)
  return `Strip ${index + 1}, ${formatInches(strip.heightIn)} across the width: ${pieces.join(', ')}.`
}

function cutting(model: BookletModel): ChecklistStep[] {
  const requirements = bookletRequirements(model)
  return requirements.fabrics.map((fabric, index) => {
    const count = fabric.cuts.length
    const lines = fabric.strips.map(stripWords)
    for (const stem of requirements.stems.filter((s) => s.fabric === fabric.fabric)) {
      lines.push(`Cut the ${formatInches(stem.squareIn)} square${stem.squares > 1 ? 's' : ''} into one continuous bias strip ${formatInches(stem.cutWidthIn)} wide, ${formatInches(stem.lengthIn)} long in all, for the stem ring.`)
    }
    if (requirements.binding.fabric === fabric.fabric) {
      const binding = requirements.binding
      lines.push(`Cut the ${formatInches(binding.squareIn)} square${binding.squares > 1 ? 's' : ''} into one continuous bias strip ${formatInches(binding.cutWidthIn)} wide, ${formatInches(binding.lengthIn)} long in all, for the binding.`)
    }
    for (const berry of requirements.berries.filter((b) => b.fabric === fabric.fabric)) {
      lines.push(`Cut a circle ${formatInches(berry.cutDiameterIn)} across from each berry square (${berry.count} in all).`)
    }
    for (const problem of requirements.problems.filter((p) => fabric.pieces.some((piece) => piece.for === p.for))) lines.push(problem.message)
    if (index === 0) lines.push(STEP_CAUTIONS.cutter)
    const onlyPiece = fabric.pieces.length === 1 && fabric.pieces[0]!.for !== 'stem' && fabric.pieces[0]!.for !== 'binding' ? fabric.pieces[0]! : null
    return {
      id: `cut:${fabric.fabric}`,
      group: 'cut',
      label: `Cut ${fabric.name}: ${plural(count, 'piece')} from ${plural(fabric.strips.length, 'strip')}`,
      instruction: lines.join(' '),
      roughCut: onlyPiece ? { widthIn: onlyPiece.widthIn, heightIn: onlyPiece.heightIn } : null,
      repeat: null,
      areas: [],
    }
  })
}

function areaStep(model: BookletModel, repeat: number, area: PlanArea, earlier: readonly PlanArea[], first: boolean): ChecklistStep {
  const fabric = fabricName(model, model.fabricOf.get(area.id) ?? '')
  const label = area.label ?? area.id
  const cut = `${size(area.roughCut.widthIn, area.roughCut.heightIn)}`
  const base = { id: `r${repeat}:area:${label}`, group: `repeat-${repeat}`, roughCut: { widthIn: area.roughCut.widthIn, heightIn: area.roughCut.heightIn }, repeat, areas: [area.id] }
  if (area.sewnAlong === null) {
    const foundation = isMirroredRepeat(model, repeat) ? `the mirrored foundation of section ${area.section}` : `the foundation of section ${area.section}`
    return {
      ...base,
      label: `Place ${fabric} on area ${label}`,
      instruction: `Take ${foundation}. Cut ${fabric} ${cut}. Lay it wrong side to the unprinted side of the paper, right side out, covering ${label} with at least 1/4 in to spare all round; pin or glue it in place.`,
    }
  }
  const line = area.sewnAlong
  const neighbours = earlier.filter((other) => other.label && sharesLine(other, line)).map((other) => other.label!)
  const leaves = leavesInBooklet(model).filter((entry) => entry.catcher?.id === area.id)
  const lines = [
    `${fabric}, cut ${cut} (the first measure runs along the seam).`,
    `Fold the paper back on the line between ${label} and ${listWords(neighbours) || 'the sewn areas'} and trim the sewn fabric 1/4 in past the fold.`,
  ]
  for (const entry of leaves) {
    const place = leafPlace(model, entry.leaf, line, entry.over, entry.catcher)
    lines.push(`Baste ${place.name} (${layersInWords(model, entry.leaf)}) ${place.words}, raw edges on the trimmed edge.`)
  }
  lines.push(`Lay the ${label} piece right side down${leaves.length > 0 ? ' over the leaves' : ''}, edges matching the trimmed edge; sew on the line with a short stitch, flip it over ${label} and press.`)
  if (first) lines.push(STEP_CAUTIONS.iron)
  return {
    ...base,
    label: `Sew area ${label} along its seam with ${listWords(neighbours) || 'the sewn areas'}`,
    instruction: lines.join(' '),
    ...(leaves.length > 0 ? { leaves: leaves.map((entry) => model.leafNames.get(entry.leaf.id) ?? 'leaf') } : {}),
  }
}

function repeatSteps(model: BookletModel, repeat: number): ChecklistStep[] {
  const steps: ChecklistStep[] = []
  model.plan.sections.forEach((section, sectionIndex) => {
    const areas = sectionAreas(model, section.label)
    // The iron's caution once, on the first seam of the whole job.
    areas.forEach((area, index) => steps.push(areaStep(model, repeat, area, areas.slice(0, index), repeat === 1 && sectionIndex === 0 && index === 1)))
    steps.push({
      id: `r${repeat}:trim:${section.label}`,
      group: `repeat-${repeat}`,
      label: `Trim section ${section.label}`,
      instruction: `Press section ${section.label} and trim it along the dashed trim line, through paper and fabric. Leave the paper in until the ring is joined.`,
      roughCut: null,
      repeat,
      areas: [],
    })
  })
  return steps
}

function sectionJoinSteps(model: BookletModel, repeat: number): ChecklistStep[] {
  const joins = sectionJoins(model.plan.assembly)
  const entries = leavesInBooklet(model).filter((entry) => entry.catcher === null && entry.section !== null)
  return joins.map((join) => {
    const caught = entries.filter((entry) => joinCatching(joins, entry.section, sectionBeyondLeaf(model, entry)) === join)
    const leafLines = caught.map((entry) => `First baste ${model.leafNames.get(entry.leaf.id) ?? 'the leaf'} on section ${entry.section} (${layersInWords(model, entry.leaf)}) on its marks, raw edges on the trimmed edge.`)
    return {
      id: `join:r${repeat}:${join.first}+${join.second}`,
      group: 'join-sections',
      label: `Repeat ${repeat}: join ${join.first} and ${join.second}`,
      instruction: [...leafLines, `Pin ${join.first} to ${join.second} at the seam ends, sew on the line, press the seam open.`].join(' '),
      roughCut: null,
      repeat,
      areas: [],
    }
  })
}

function ringSteps(model: BookletModel): ChecklistStep[] {
  const { ring } = model.design
  const n = ring.repeats
  const assembly = model.plan.ringAssembly
  const step = (index: number, label: string, instruction: string): ChecklistStep => ({ id: `ring:join:${index}`, group: 'join-repeats', label, instruction, roughCut: null, repeat: null, areas: [] })
  const joined = (from: number, to: number) => (to === from ? `repeat ${from}` : `repeats ${from}\u2013${to}`)
  const pin = 'Pin at the seam ends and where the seams meet, sew on the line, press the seam open.'
  const mirrorNote = ring.repeatMode === 'mirror' ? ' Each mirrored repeat sits between two plain ones.' : ''
  const steps: ChecklistStep[] = []
  if (assembly.kind === 'halves') {
    const half = n / 2
    for (const start of [1, half + 1]) {
      for (let k = start + 1; k < start + half; k += 1) {
        steps.push(step(steps.length + 1, `Join repeat ${k} to ${joined(start, k - 1)}`, `Join along the radial seam. ${pin}${mirrorNote}`))
      }
    }
    steps.push(step(steps.length + 1, `Join the two halves (${joined(1, half)} and ${joined(half + 1, n)})`, `${assembly.message} ${pin}`))
    return steps
  }
  for (let k = 2; k <= n; k += 1) steps.push(step(steps.length + 1, `Join repeat ${k} to ${joined(1, k - 1)}`, `Join along the radial seam. ${pin}${mirrorNote}`))
  if (assembly.kind === 'chain') steps.push(step(steps.length + 1, `Close the ring: join repeat ${n} to repeat 1`, `${assembly.message} ${pin}`))
  else steps.push(step(steps.length + 1, 'Finish the centre', assembly.message))
  return steps
}

function finishingSteps(model: BookletModel): ChecklistStep[] {
  const { design } = model
  const step = (id: string, label: string, instruction: string): ChecklistStep => ({ id: `finish:${id}`, group: 'finishing', label, instruction, roughCut: null, repeat: null, areas: [] })
  const steps: ChecklistStep[] = [step('papers', 'Tear away the foundation papers', 'Press the joined ring and tear away the papers, starting from the outside seams.')]
  design.stems.forEach((stem, index) => {
    const sewing = stemSewing(stem)
    const trim = sewing.trimAllowance ? ` Trim the seam allowance to less than ${formatInches(stem.finishedWidth)} first, so the strip hides it.` : ''
    steps.push(
      step(
        `stem:${index + 1}`,
        design.stems.length > 1 ? `Sew stem ring ${index + 1}` : 'Sew the stem ring',
        `Fold the ${formatInches(sewing.cutWidthIn)} bias strip (${formatInches(stemStrip(stem).lengthIn)} long) in half lengthwise, wrong sides together. Trace the stem's circles from the placement guide, sew the strip's raw edges on the centre side of the inner circle 1/4 in from them, press it over toward the outer edge so its fold lies on the outer circle, ${formatInches(stem.finishedWidth)} wide, and stitch the fold down by hand.${trim}`,
      ),
    )
  })
  if (design.curls.length > 0) {
    steps.push(step('curls', 'Embroider the curling stems', `Trace the ${plural(design.curls.length * design.ring.repeats, 'curl')} from the placement guide and embroider them in outline stitch with 2 or 3 strands of floss.`))
  }
  steps.push(step('quilting', 'Layer and quilt', 'Layer the top with batting and backing, baste and quilt it.'))
  if (design.berries.length > 0) {
    const count = design.berries.length * design.ring.repeats
    const first = design.berries[0]!
    steps.push(
      step(
        'berries',
        `Make and stitch the ${plural(count, 'berry', 'berries')}`,
        `Run a gathering stitch near the edge of each ${formatInches(berryCutDiameterInches(first.finishedDiameter))} circle, stuff lightly, draw up and stitch each at its mark on the placement guide. ${STEP_CAUTIONS.berries}`,
      ),
    )
  }
  const binding = bindingPlan(design)
  const edges = binding.edges.map((edge) => `${edge.stripLengthIn} in for the ${edge.edge} edge`).join(' and ')
  steps.push(
    step(
      'binding',
      `Bind the ${binding.edges.length > 1 ? 'outer and inner edges' : 'edge'}`,
      `Bind with double-fold bias binding ${formatInches(binding.cutWidthIn)} wide from ${fabricName(model, binding.fabric)} (${edges}); join each strip's ends on its own edge.`,
    ),
  )
  return steps
}

/**
 * The checklist of a design's model (see `sewingModel`): groups in work order and every step.
 * Groups without steps (no leaves, one section) are left out.
 *
 * @example checklistOfModel(sewingModel(design, { colorway: 0, diameterIn: 18 })).steps[0]?.id // 'leaves:leaf-dark'
 */
export function checklistOfModel(model: BookletModel): Checklist {
  const n = model.design.ring.repeats
  const candidates: { group: ChecklistGroup; steps: ChecklistStep[] }[] = [
    { group: { id: 'prepare-leaves', label: 'Prepare the leaves' }, steps: leafPreparation(model) },
    { group: { id: 'cut', label: 'Cut' }, steps: cutting(model) },
  ]
  for (let repeat = 1; repeat <= n; repeat += 1) {
    const label = `Repeat ${repeat}${isMirroredRepeat(model, repeat) ? ' (mirror image)' : ''}`
    candidates.push({ group: { id: `repeat-${repeat}`, label }, steps: repeatSteps(model, repeat) })
  }
  const joins: ChecklistStep[] = []
  for (let repeat = 1; repeat <= n; repeat += 1) joins.push(...sectionJoinSteps(model, repeat))
  candidates.push({ group: { id: 'join-sections', label: 'Join the sections' }, steps: joins })
  candidates.push({ group: { id: 'join-repeats', label: 'Join the repeats' }, steps: ringSteps(model) })
  candidates.push({ group: { id: 'finishing', label: 'Finishing' }, steps: finishingSteps(model) })
  const kept = candidates.filter((candidate) => candidate.steps.length > 0)
  return { groups: kept.map((candidate) => candidate.group), steps: kept.flatMap((candidate) => candidate.steps) }
}

/**
 * The checklist of a design made in one colourway at one finished diameter.
 *
 * @example sewingChecklist(design, { colorway: 0, diameterIn: 18 }).groups.map((group) => group.id) // ['prepare-leaves', 'cut', 'repeat-1', …, 'finishing']
 */
export function sewingChecklist(design: Parameters<typeof bookletModel>[0], options: ChecklistOptions): Checklist {
  return checklistOfModel(sewingModel(design, options))
}
