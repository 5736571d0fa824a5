/**
 * Every change a designer can make on the drafting board, as named commands in one table. A
 * command takes the design and its arguments and returns the next design; it never mutates its
 * input. The mouse, the keyboard, the panels and the tests all go through this table.
 */
import { scaleDesignLengths } from '@/geometry/design-lengths'
import { LAYER_SCALE_RANGE, LAYER_TURN_LIMIT_DEGREES } from '@/geometry/leaf-template'
import { spreadLeafFabrics } from '@/geometry/spread-leaf-fabrics'
import type { Leaf as CoreLeaf, Point, Seam as CoreSeam } from '@/geometry'
import { fabricRoleInWords } from '@/geometry/fabric-requirements'
import { MAX_COLORWAYS, MAX_NAME_LENGTH } from '@/lib/limits'
import {
  colorwayNameSchema, fabricNameSchema, fabricRoleSchema, hexColourSchema, uploadIdSchema, type ColorwayFabric, type DesignFile,
} from '@/lib/schemas/design'
import { unitsPerInch } from '@/lib/units'
import { suggestedLeavesInDesignUnits, suggestedSeamsInDesignUnits } from './board-plan'

type Seam = DesignFile['seams'][number]
type Leaf = NonNullable<DesignFile['leaves']>[number]
type LayerOffset = NonNullable<Leaf['layerOffsets']>[number]
type Berry = NonNullable<DesignFile['berries']>[number]
type StemRing = NonNullable<DesignFile['stems']>[number]
type Colorway = NonNullable<DesignFile['colorways']>[number]
export type BoardRing = DesignFile['ring']
export type HandOrder = NonNullable<DesignFile['order']>

/** A design with every optional list present, as the board keeps it. */
export type BoardDesign = DesignFile & {
  fills: NonNullable<DesignFile['fills']>
  leaves: Leaf[]
  stems: StemRing[]
  berries: Berry[]
  curls: NonNullable<DesignFile['curls']>
  colorways: Colorway[]
  order: HandOrder | null
}

export function normalizeDesign(design: DesignFile): BoardDesign {
  return {
    ...design,
    fills: design.fills ?? [],
    leaves: design.leaves ?? [],
    stems: design.stems ?? [],
    berries: design.berries ?? [],
    curls: design.curls ?? [],
    colorways: design.colorways && design.colorways.length > 0 ? design.colorways : [{ name: 'Main', fabrics: {} }],
    order: design.order ?? null,
  }
}

export interface Command<Args> {
  readonly name: string
  readonly run: (design: BoardDesign, args: Args) => BoardDesign
}

export function defineCommand<Args>(command: Command<Args>): Command<Args> {
  return command
}

/** The smallest id of the form `prefix` + number that no item uses. */
export function nextId(prefix: string, taken: readonly { id: string }[]): string {
  const used = new Set(taken.map((item) => item.id))
  let n = 1
  while (used.has(`${prefix}${n}`)) n += 1
  return `${prefix}${n}`
}

const round = (value: number) => Math.round(value * 10_000) / 10_000
const roundPoint = (p: Point): [number, number] => [round(p[0]), round(p[1])]
const samePoint = (a: readonly number[], b: readonly number[]) => a[0] === b[0] && a[1] === b[1]

/**
 * Adding or removing a seam changes how many areas there are, so an order set by hand cannot
 * carry over and is dropped. Moving a seam keeps it: its areas are named by points, and the plan
 * checks the order again and says which step fails if an area has moved away from its point.
 */
const withoutHandOrder = (design: BoardDesign): BoardDesign => (design.order ? { ...design, order: null } : design)

export const setRing = defineCommand({
  name: 'set-ring',
  run: (design, ring: Partial<BoardRing>) => ({ ...design, ring: { ...design.ring, ...ring } }),
})

export const addSeam = defineCommand({
  name: 'add-seam',
  run: (design, { from, to, id }: { from: Point; to: Point; id?: string }) => {
    if (samePoint(roundPoint(from), roundPoint(to))) return design
    const seam: Seam = { id: id ?? nextId('s', design.seams), from: roundPoint(from), to: roundPoint(to) }
    return withoutHandOrder({ ...design, seams: [...design.seams, seam] })
  },
})

export const moveSeamEnd = defineCommand({
  name: 'move-seam-end',
  run: (design, { seamId, end, to }: { seamId: string; end: 'from' | 'to'; to: Point }) => ({
    ...design,
    seams: design.seams.map((seam) => (seam.id === seamId ? { ...seam, [end]: roundPoint(to) } : seam)),
  }),
})

/** Moves a whole seam by an offset, both ends together. */
export const moveSeam = defineCommand({
  name: 'move-seam',
  run: (design, { seamId, by }: { seamId: string; by: Point }) => ({
    ...design,
    seams: design.seams.map((seam) =>
      seam.id === seamId
        ? { ...seam, from: roundPoint([seam.from[0] + by[0], seam.from[1] + by[1]]), to: roundPoint([seam.to[0] + by[0], seam.to[1] + by[1]]) }
        : seam,
    ),
  }),
})

/** Deletes a seam and the leaves caught in it. */
export const deleteSeam = defineCommand({
  name: 'delete-seam',
  run: (design, { seamId }: { seamId: string }) =>
    withoutHandOrder({
      ...design,
      seams: design.seams.filter((seam) => seam.id !== seamId),
      leaves: design.leaves.filter((leaf) => leaf.seam !== seamId),
    }),
})

/**
 * Applies a repair the plan suggested: the design's seams become the suggestion's (core inches,
 * converted once by `suggestedSeamsInDesignUnits`), ids kept, so every leaf stays on its seam
 * as it was; a suggestion that resizes a leaf brings the leaves too (`suggestedLeavesInDesignUnits`:
 * only sizes change). Only the designer runs it (the panel's button); undo gives everything back
 * exactly, all in one step. An order set by hand is dropped when the seams change (the
 * suggestion's section count is that of the order the plan proposes, and an extended or added
 * seam splits areas the hand order named) and when the suggestion says so (`clearsOrder`: "Let
 * Wreathwright choose the order"); a resized leaf alone keeps it.
 */
export const applyRepair = defineCommand({
  name: 'apply-repair',
  run: (design, { seams, leaves, clearsOrder }: { seams: readonly CoreSeam[]; leaves?: readonly CoreLeaf[]; clearsOrder?: boolean }) => {
    const next = suggestedSeamsInDesignUnits(design, seams)
    const seamsUnchanged = next.length === design.seams.length && next.every((seam, i) => {
      const old = design.seams[i]!
      return seam.id === old.id && samePoint(seam.from, old.from) && samePoint(seam.to, old.to)
    })
    const nextLeaves = leaves ? suggestedLeavesInDesignUnits(design, leaves) : design.leaves
    const leavesUnchanged = nextLeaves.every((leaf, i) => leaf === design.leaves[i])
    const dropsOrder = design.order !== null && (!seamsUnchanged || clearsOrder === true)
    if (seamsUnchanged && leavesUnchanged && !dropsOrder) return design
    const changed = { ...design, seams: seamsUnchanged ? design.seams : next, leaves: leavesUnchanged ? design.leaves : nextLeaves }
    return dropsOrder ? withoutHandOrder(changed) : changed
  },
})

/**
 * Fills the area around a point with a fabric. One fill per area: `replacing` lists points of
 * earlier fills that name the same area (the board finds them through the plan).
 */
export const fillArea = defineCommand({
  name: 'fill-area',
  run: (design, { at, fabric, replacing = [] }: { at: Point; fabric: string; replacing?: readonly Point[] }) => ({
    ...design,
    fills: [
      ...design.fills.filter((fill) => !replacing.some((point) => samePoint(point, fill.at))),
      { at: roundPoint(at), fabric },
    ],
  }),
})

export const clearFill = defineCommand({
  name: 'clear-fill',
  run: (design, { points }: { points: readonly Point[] }) => ({
    ...design,
    fills: design.fills.filter((fill) => !points.some((point) => samePoint(point, fill.at))),
  }),
})

// Colourways. Fabric roles (background, leaf-dark …) are shared by every colourway; each colourway
// gives every role a fabric: a display name, a colour and, optionally, a swatch image. A colourway
// is named by its name (unique in a design). Arguments that the schema would refuse (an empty
// name, a name taken, a colour that is not #rrggbb) leave the design as it is, so nothing is
// recorded: the board's forms check with the same schemas first and say why.

const changeFabric = (design: BoardDesign, colorway: string, fabric: string, change: (f: ColorwayFabric) => ColorwayFabric): BoardDesign => {
  const target = design.colorways.find((c) => c.name === colorway)
  if (!target || !Object.hasOwn(target.fabrics, fabric)) return design
  return { ...design, colorways: design.colorways.map((c) => (c === target ? { ...c, fabrics: { ...c.fabrics, [fabric]: change(c.fabrics[fabric]!) } } : c)) }
}

/** The colour of one role's fabric in one colourway (#rrggbb). */
export const setFabricColour = defineCommand({
  name: 'set-fabric-colour',
  run: (design, { colorway, fabric, colour }: { colorway: string; fabric: string; colour: string }) => {
    const parsed = hexColourSchema.safeParse(colour)
    return parsed.success ? changeFabric(design, colorway, fabric, (f) => ({ ...f, color: parsed.data.toLowerCase() })) : design
  },
})

/** The display name of one role's fabric in one colourway ("Cream tone-on-tone"). */
export const renameFabric = defineCommand({
  name: 'rename-fabric',
  run: (design, { colorway, fabric, name }: { colorway: string; fabric: string; name: string }) => {
    const parsed = fabricNameSchema.safeParse(name)
    return parsed.success ? changeFabric(design, colorway, fabric, (f) => ({ ...f, name: parsed.data })) : design
  },
})

/** The swatch image of one role's fabric in one colourway, by its upload id; null removes it. */
export const setFabricSwatch = defineCommand({
  name: 'set-fabric-swatch',
  run: (design, { colorway, fabric, swatch }: { colorway: string; fabric: string; swatch: string | null }) => {
    const parsed = swatch === null ? null : uploadIdSchema.safeParse(swatch)
    const current = design.colorways.find((c) => c.name === colorway)?.fabrics[fabric]
    // Nothing to change records nothing: an id refused, or the swatch it already has (or none).
    if ((parsed && !parsed.success) || current?.swatch === (parsed?.data ?? undefined)) return design
    return changeFabric(design, colorway, fabric, ({ swatch: _dropped, ...rest }) => (parsed ? { ...rest, swatch: parsed.data! } : rest))
  },
})

/**
 * The theme-fabric photo a colourway starts from, by its upload id (its palette is the upload's);
 * null removes it. Each colourway has its own: the board shows the photo of the one shown.
 */
export const setThemePhoto = defineCommand({
  name: 'set-theme-photo',
  run: (design, { colorway, upload }: { colorway: string; upload: string | null }) => {
    const target = design.colorways.find((c) => c.name === colorway)
    if (!target) return design
    const replaced = (next: Colorway): BoardDesign => ({ ...design, colorways: design.colorways.map((c) => (c === target ? next : c)) })
    if (upload === null) {
      const { themePhoto, ...rest } = target
      return themePhoto === undefined ? design : replaced(rest)
    }
    const parsed = uploadIdSchema.safeParse(upload)
    return !parsed.success || parsed.data === target.themePhoto ? design : replaced({ ...target, themePhoto: parsed.data })
  },
})

/**
 * Adds a fabric role to every colourway, each with the given starting colour and a display name
 * (default: the role in words, "leaf-medium" → "Leaf medium"). A role already there is left as it is.
 */
export const addFabric = defineCommand({
  name: 'add-fabric',
  run: (design, { fabric, colour, name }: { fabric: string; colour: string; name?: string }) => {
    const role = fabricRoleSchema.safeParse(fabric)
    const fabricName = fabricNameSchema.safeParse(name ?? fabricRoleInWords(fabric))
    const color = hexColourSchema.safeParse(colour)
    if (!role.success || !fabricName.success || !color.success) return design
    const added: ColorwayFabric = { name: fabricName.data, color: color.data.toLowerCase() }
    if (design.colorways.every((c) => Object.hasOwn(c.fabrics, role.data))) return design
    return { ...design, colorways: design.colorways.map((c) => (Object.hasOwn(c.fabrics, role.data) ? c : { ...c, fabrics: { ...c.fabrics, [role.data]: added } })) }
  },
})

const copyFabrics = (fabrics: Colorway['fabrics']): Colorway['fabrics'] =>
  Object.fromEntries(Object.entries(fabrics).map(([fabric, f]) => [fabric, { ...f }]))

/** A name no colourway of the design has yet: `base`, else `base 2`, `base 3` … */
export function freeColorwayName(design: Pick<BoardDesign, 'colorways'>, base: string): string {
  const taken = new Set(design.colorways.map((c) => c.name))
  if (!taken.has(base)) return base
  let n = 2
  while (taken.has(`${base} ${n}`)) n += 1
  return `${base} ${n}`
}

/**
 * A new colourway, at the end, starts as a copy of another's fabrics (default the first), to be
 * recoloured; not of its theme photo, as a new colourway usually starts from a fabric of its own.
 */
export const addColorway = defineCommand({
  name: 'add-colorway',
  run: (design, { name, copyOf }: { name: string; copyOf?: string }) => {
    const parsed = colorwayNameSchema.safeParse(name)
    if (!parsed.success || design.colorways.some((c) => c.name === parsed.data) || design.colorways.length >= MAX_COLORWAYS) return design
    const source = design.colorways.find((c) => c.name === copyOf) ?? design.colorways[0]
    return { ...design, colorways: [...design.colorways, { name: parsed.data, fabrics: copyFabrics(source?.fabrics ?? {}) }] }
  },
})

/** A copy of a colourway, right after it, named `<name> copy` (or the name given). */
export const duplicateColorway = defineCommand({
  name: 'duplicate-colorway',
  run: (design, { colorway, name }: { colorway: string; name?: string }) => {
    const index = design.colorways.findIndex((c) => c.name === colorway)
    if (index < 0 || design.colorways.length >= MAX_COLORWAYS) return design
    const parsed = colorwayNameSchema.safeParse(name ?? freeColorwayName(design, `${colorway} copy`.slice(0, MAX_NAME_LENGTH)))
    if (!parsed.success || design.colorways.some((c) => c.name === parsed.data)) return design
    // The copy keeps the theme photo: the same fabric to start from, recoloured from there.
    const copy = { ...design.colorways[index]!, name: parsed.data, fabrics: copyFabrics(design.colorways[index]!.fabrics) }
    return { ...design, colorways: [...design.colorways.slice(0, index + 1), copy, ...design.colorways.slice(index + 1)] }
  },
})

export const renameColorway = defineCommand({
  name: 'rename-colorway',
  run: (design, { colorway, name }: { colorway: string; name: string }) => {
    const parsed = colorwayNameSchema.safeParse(name)
    if (!parsed.success || parsed.data === colorway || design.colorways.some((c) => c.name === parsed.data)) return design
    if (!design.colorways.some((c) => c.name === colorway)) return design
    return { ...design, colorways: design.colorways.map((c) => (c.name === colorway ? { ...c, name: parsed.data } : c)) }
  },
})

/** Moves a colourway earlier (`by` −1) or later (+1) in the list; the first is the default one. */
export const moveColorway = defineCommand({
  name: 'move-colorway',
  run: (design, { colorway, by }: { colorway: string; by: number }) => {
    const from = design.colorways.findIndex((c) => c.name === colorway)
    const to = Math.min(design.colorways.length - 1, Math.max(0, from + Math.trunc(by)))
    if (from < 0 || to === from) return design
    const colorways = design.colorways.filter((_, i) => i !== from)
    colorways.splice(to, 0, design.colorways[from]!)
    return { ...design, colorways }
  },
})

/** Deletes a colourway; the last one of a design is never deleted (the board always shows one). */
export const deleteColorway = defineCommand({
  name: 'delete-colorway',
  run: (design, { colorway }: { colorway: string }) => {
    if (design.colorways.length <= 1 || !design.colorways.some((c) => c.name === colorway)) return design
    return { ...design, colorways: design.colorways.filter((c) => c.name !== colorway) }
  },
})

export const addLeaf = defineCommand({
  name: 'add-leaf',
  run: (design, leaf: Omit<Leaf, 'id'> & { id?: string }) => {
    if (!design.seams.some((seam) => seam.id === leaf.seam)) return design
    return { ...design, leaves: [...design.leaves, { angle: 0, ...leaf, id: leaf.id ?? nextId('l', design.leaves) }] }
  },
})

export const updateLeaf = defineCommand({
  name: 'update-leaf',
  run: (design, { leafId, changes }: { leafId: string; changes: Partial<Omit<Leaf, 'id'>> }) => ({
    ...design,
    leaves: design.leaves.map((leaf) => (leaf.id === leafId ? { ...leaf, ...changes } : leaf)),
  }),
})

export const flipLeafSide = defineCommand({
  name: 'flip-leaf-side',
  run: (design, { leafId }: { leafId: string }) => ({
    ...design,
    leaves: design.leaves.map((leaf) =>
      leaf.id === leafId ? { ...leaf, side: leaf.side === 'left' ? ('right' as const) : ('left' as const) } : leaf,
    ),
  }),
})

/** A leaf's layer offsets, one per layer (`{}` for a layer on the default fan). */
const offsetsOf = (leaf: Leaf): LayerOffset[] => leaf.layers.map((_, index) => leaf.layerOffsets?.[index] ?? {})

/**
 * The leaf with new layers and their offsets, kept one per layer. When every layer is on the
 * default fan the offsets are left out, so the file reads the same to a reader from before offsets.
 */
function withLayers(leaf: Leaf, layers: readonly string[], offsets: readonly LayerOffset[]): Leaf {
  const { layerOffsets: _dropped, ...rest } = leaf
  const kept = layers.map((_, index) => offsets[index] ?? {})
  return kept.some((offset) => offset.turn !== undefined || offset.scale !== undefined) ? { ...rest, layers: [...layers], layerOffsets: kept } : { ...rest, layers: [...layers] }
}

const changeLeaf = (design: BoardDesign, leafId: string, change: (leaf: Leaf) => Leaf): BoardDesign => ({
  ...design,
  leaves: design.leaves.map((leaf) => (leaf.id === leafId ? change(leaf) : leaf)),
})

const clamp = (value: number, low: number, high: number) => Math.min(high, Math.max(low, value))

/**
 * Turns (degrees) and sizes (a ratio) one stacked layer against the leaf as drawn; `null` puts
 * that member back on the default fan, `undefined` leaves it. Values are kept to the file's range.
 */
export const setLeafLayerOffset = defineCommand({
  name: 'set-leaf-layer-offset',
  run: (design, { leafId, index, turn, scale }: { leafId: string; index: number; turn?: number | null; scale?: number | null }) =>
    changeLeaf(design, leafId, (leaf) => {
      if (index < 0 || index >= leaf.layers.length) return leaf
      const offsets = offsetsOf(leaf)
      const next: { turn?: number; scale?: number } = { ...offsets[index] }
      if (turn === null) delete next.turn
      else if (turn !== undefined) next.turn = round(clamp(turn, -LAYER_TURN_LIMIT_DEGREES, LAYER_TURN_LIMIT_DEGREES))
      if (scale === null) delete next.scale
      else if (scale !== undefined) next.scale = round(clamp(scale, LAYER_SCALE_RANGE[0], LAYER_SCALE_RANGE[1]))
      return withLayers(leaf, leaf.layers, offsets.map((offset, i) => (i === index ? next : offset)))
    }),
})

/** Changes the fabric of one stacked layer. */
export const setLeafLayerFabric = defineCommand({
  name: 'set-leaf-layer-fabric',
  run: (design, { leafId, index, fabric }: { leafId: string; index: number; fabric: string }) =>
    changeLeaf(design, leafId, (leaf) => (index < 0 || index >= leaf.layers.length ? leaf : withLayers(leaf, leaf.layers.map((f, i) => (i === index ? fabric : f)), offsetsOf(leaf)))),
})

/** Adds a layer on top of the stack, on the default fan. */
export const addLeafLayer = defineCommand({
  name: 'add-leaf-layer',
  run: (design, { leafId, fabric }: { leafId: string; fabric: string }) =>
    changeLeaf(design, leafId, (leaf) => withLayers(leaf, [...leaf.layers, fabric], [...offsetsOf(leaf), {}])),
})

/** Removes one layer and its offset; the last layer of a leaf stays. */
export const removeLeafLayer = defineCommand({
  name: 'remove-leaf-layer',
  run: (design, { leafId, index }: { leafId: string; index: number }) =>
    changeLeaf(design, leafId, (leaf) =>
      leaf.layers.length <= 1 || index < 0 || index >= leaf.layers.length
        ? leaf
        : withLayers(leaf, leaf.layers.filter((_, i) => i !== index), offsetsOf(leaf).filter((_, i) => i !== index))),
})

/**
 * Deals the fabrics already on the leaves out again around the ring, so neighbours differ and
 * counts are even (`spreadLeafFabrics`); offsets stay with their layers. Nothing to improve
 * records nothing. The designer then changes any leaf in the inspector.
 */
export const spreadLeafColours = defineCommand({
  name: 'spread-leaf-colours',
  run: (design, _args: Record<string, never>) => {
    const spread = new Map(spreadLeafFabrics(design).leaves.map((leaf) => [leaf.id, leaf.layers]))
    let changed = false
    const leaves = design.leaves.map((leaf) => {
      const layers = spread.get(leaf.id)
      if (!layers || layers.every((fabric, index) => fabric === leaf.layers[index])) return leaf
      changed = true
      return { ...leaf, layers: [...layers] }
    })
    return changed ? { ...design, leaves } : design
  },
})

export const deleteLeaf = defineCommand({
  name: 'delete-leaf',
  run: (design, { leafId }: { leafId: string }) => ({ ...design, leaves: design.leaves.filter((leaf) => leaf.id !== leafId) }),
})

/** One appliqué stem ring per design: setting it replaces the old one; null removes it. */
export const setStemRing = defineCommand({
  name: 'set-stem-ring',
  run: (design, stem: StemRing | null) => ({ ...design, stems: stem ? [{ ...stem, radius: round(stem.radius) }] : [] }),
})

export const addBerry = defineCommand({
  name: 'add-berry',
  run: (design, berry: Berry) => ({ ...design, berries: [...design.berries, { ...berry, at: roundPoint(berry.at) }] }),
})

export const updateBerry = defineCommand({
  name: 'update-berry',
  run: (design, { index, changes }: { index: number; changes: Partial<Berry> }) => ({
    ...design,
    berries: design.berries.map((berry, i) => (i === index ? { ...berry, ...changes, at: roundPoint(changes.at ?? berry.at) } : berry)),
  }),
})

export const deleteBerry = defineCommand({
  name: 'delete-berry',
  run: (design, { index }: { index: number }) => ({ ...design, berries: design.berries.filter((_, i) => i !== index) }),
})

export const addCurl = defineCommand({
  name: 'add-curl',
  run: (design, { points }: { points: readonly Point[] }) =>
    points.length < 2 ? design : { ...design, curls: [...design.curls, { points: points.map(roundPoint) }] },
})

export const deleteCurl = defineCommand({
  name: 'delete-curl',
  run: (design, { index }: { index: number }) => ({ ...design, curls: design.curls.filter((_, i) => i !== index) }),
})

/** Sets (or, with null, clears) a sewing order chosen by hand. */
export const setHandOrder = defineCommand({
  name: 'set-hand-order',
  run: (design, order: HandOrder | null) => ({ ...design, order }),
})

export const renameDesign = defineCommand({
  name: 'rename-design',
  run: (design, { name }: { name: string }) => ({ ...design, name }),
})

/**
 * Switches the design between inches and centimetres, converting every length (through the one
 * scaler, `scaleDesignLengths`) so the ring stays the same size. Angles, fractions along a seam
 * and colours are unitless and stay.
 */
export const setUnits = defineCommand({
  name: 'set-units',
  run: (design, { units }: { units: 'in' | 'cm' }) => {
    if (design.units === units) return design
    return { ...scaleDesignLengths(design, unitsPerInch(units) / unitsPerInch(design.units), round), units }
  },
})

/** Replaces the whole design (import of a file, or taking the saved version after a conflict). */
export const replaceDesign = defineCommand({
  name: 'replace-design',
  run: (_design, { design }: { design: DesignFile }) => normalizeDesign(design),
})

/** The table the store, the shortcuts and the panels use. */
export const commands = {
  setRing,
  addSeam,
  moveSeamEnd,
  moveSeam,
  deleteSeam,
  applyRepair,
  fillArea,
  clearFill,
  setFabricColour,
  renameFabric,
  setFabricSwatch,
  setThemePhoto,
  addFabric,
  addColorway,
  duplicateColorway,
  renameColorway,
  moveColorway,
  deleteColorway,
  addLeaf,
  updateLeaf,
  flipLeafSide,
  deleteLeaf,
  setLeafLayerOffset,
  setLeafLayerFabric,
  addLeafLayer,
  removeLeafLayer,
  spreadLeafColours,
  setStemRing,
  addBerry,
  updateBerry,
  deleteBerry,
  addCurl,
  deleteCurl,
  setHandOrder,
  renameDesign,
  setUnits,
  replaceDesign,
} as const

export type CommandTable = typeof commands
export type CommandName = keyof CommandTable
export type CommandArgs<Name extends CommandName> = Parameters<CommandTable[Name]['run']>[1]
