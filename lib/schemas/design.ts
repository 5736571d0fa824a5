/**
 * The design file (format `wreathwright-design`, version 2) as one zod schema, shared by the
 * API, the drafting board and the command line. `parseDesign` is the one edge where a file
 * becomes the core's `Design`: centimetres are converted to inches here, once.
 *
 * Version 2 gives each fabric role of a colourway a fabric (`{ name, color, swatch? }`, the swatch
 * an upload id) where version 1 gave it only a colour; a colourway may also name its theme-fabric
 * photo (`themePhoto`, an upload id). A version 1 file still reads: `designFileSchema` upgrades it
 * first (`upgradeDesignFile`), so every reader — the API, the board, the command line, the
 * stored revisions — gets version 2, and every writer writes version 2.
 */
import { z } from 'zod'
import { scaleDesignLengths } from '@/geometry/design-lengths'
import { fabricRoleInWords } from '@/geometry/fabric-requirements'
import { LAYER_SCALE_RANGE, LAYER_TURN_LIMIT_DEGREES } from '@/geometry/leaf-template'
import type { Design, HandSetOrder, JoinTree, Point } from '@/geometry/types'
import {
  MAX_AREAS, MAX_BERRIES, MAX_COLORWAYS, MAX_CURLS, MAX_FABRICS_PER_COLORWAY, MAX_ID_LENGTH, MAX_LAYERS_PER_LEAF, MAX_LEAVES,
  MAX_NAME_LENGTH, MAX_POINTS_PER_CURL, MAX_ROLE_LENGTH, MAX_SEAMS, MAX_SECTIONS, MAX_STEMS, MAX_UPLOAD_KEY_LENGTH,
  MAX_REPEATS, MIN_REPEATS,
} from '@/lib/limits'
import { CENTIMETRES_PER_INCH } from '@/lib/units'
import { text } from './text'

// zod 4's number() already refuses NaN and ±Infinity, so every coordinate is finite.
const finite = z.number()
const positive = finite.positive()
const point = z.tuple([finite, finite])

// Every string of a design is free text: checked and normalised by the one helper (./text.ts),
// and no longer than its limit (lib/limits.ts).
const id = text({ max: MAX_ID_LENGTH })
const role = text({ max: MAX_ROLE_LENGTH })

/** A list of at most `max` items, refused as "at most 400 seams" (the limits of lib/limits.ts). */
const list = <T extends z.ZodType>(item: T, max: number, what: string) => z.array(item).max(max, `at most ${max} ${what}`)

const seam = z.strictObject({ id, from: point, to: point })
const fill = z.strictObject({ at: point, fabric: role })

/**
 * How one stacked layer lies against the leaf as drawn: `turn` in degrees (counter-clockwise,
 * added to the leaf's angle) and `scale`, a ratio of its length and width to the leaf's. Neither
 * is a length: a centimetre file writes the same numbers. A member left out takes the default fan
 * (geometry/leaf-template.ts `defaultLayerOffset`); so does every layer of a leaf without
 * `layerOffsets`, which is how every file written before offsets existed reads.
 */
const layerOffset = z.strictObject({
  turn: finite.min(-LAYER_TURN_LIMIT_DEGREES).max(LAYER_TURN_LIMIT_DEGREES).optional(),
  scale: finite.min(LAYER_SCALE_RANGE[0]).max(LAYER_SCALE_RANGE[1]).optional(),
})

const leaf = z.strictObject({
  id,
  seam: id,
  at: finite.min(0).max(1),
  side: z.enum(['left', 'right']),
  angle: finite.min(-75).max(75).optional(),
  length: positive,
  width: positive,
  layers: list(role, MAX_LAYERS_PER_LEAF, 'layers').min(1),
  /** One per layer, same order (bottom first), when present. */
  layerOffsets: list(layerOffset, MAX_LAYERS_PER_LEAF, 'layer offsets').optional(),
})

const stem = z.strictObject({ radius: positive, finishedWidth: positive, fabric: role })
/** Double-fold bias binding: its cut width (a length, file units) and the fabric role it is cut from; either may be left out. */
const binding = z.strictObject({ cutWidth: positive.optional(), fabric: role.optional() })
const berry = z.strictObject({ at: point, finishedDiameter: positive, fabric: role })
const curl = z.strictObject({ points: list(point, MAX_POINTS_PER_CURL, 'points in a curl').min(2) })
/** A colour as `#rrggbb`. */
export const hexColourSchema = z.string().regex(/^#[0-9a-fA-F]{6}$/, 'a colour is #rrggbb')

/**
 * A colourway's name ("Winter berries"), and a fabric's display name ("Cream tone-on-tone"): the
 * schemas the board's forms and its commands check with, the same as the file's.
 */
export const colorwayNameSchema = text({ max: MAX_NAME_LENGTH })
export const fabricNameSchema = text({ max: MAX_NAME_LENGTH })
/** A fabric role: the key the areas, leaves, stems and berries name ("leaf-dark"). */
export const fabricRoleSchema = role

/** An upload's id: 8-4-4-4-12 hex digits, as the upload route answers it (lib/services/uploads.ts). */
const UPLOAD_ID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i

/**
 * An uploaded image named by its upload id, as `POST /api/uploads` answers it and
 * `/api/uploads/<id>` serves it to those allowed to read it (lib/authorization.ts). The design
 * keeps only the id; whether the image still exists, and who may see it, is the upload's business.
 * Written in lower case.
 *
 * @example uploadIdSchema.parse('6F1C2B3A-0D4E-4F5A-8B6C-7D8E9F0A1B2C') // '6f1c2b3a-0d4e-4f5a-8b6c-7d8e9f0a1b2c'
 */
export const uploadIdSchema = z.string().regex(UPLOAD_ID, 'an upload id is a UUID, as the upload answered it').toLowerCase()

/** What a colourway gives one fabric role: the fabric as the maker buys it, and a swatch image of it. */
export const colorwayFabricSchema = z.strictObject({ name: fabricNameSchema, color: hexColourSchema, swatch: uploadIdSchema.optional() })

/**
 * A colourway: a fabric for every role, and the theme-fabric photo it was started from (an upload
 * of kind `fabric-photo`, whose stored palette the board proposes).
 */
const colorway = z.strictObject({
  name: colorwayNameSchema,
  fabrics: z
    .record(role, colorwayFabricSchema)
    .refine((fabrics) => Object.keys(fabrics).length <= MAX_FABRICS_PER_COLORWAY, `at most ${MAX_FABRICS_PER_COLORWAY} fabrics in a colourway`),
  themePhoto: uploadIdSchema.optional(),
})

const joinTree: z.ZodType<JoinTree> = z.lazy(() => z.union([id, z.tuple([joinTree, joinTree])]))

/**
 * How deeply a value nests arrays, counted without recursion (an explicit stack), so that a
 * 5,000-deep `assembly` is measured and refused before zod's recursive parse could overflow the
 * call stack. Stops counting past `limit`.
 *
 * @example nestingDepth([['A', 'B'], 'C'], 10) // 2
 */
export function nestingDepth(value: unknown, limit: number): number {
  let deepest = 0
  const stack: [unknown, number][] = [[value, 0]]
  while (stack.length > 0) {
    const [item, depth] = stack.pop()!
    if (!Array.isArray(item)) continue
    deepest = Math.max(deepest, depth + 1)
    if (deepest > limit) return deepest
    for (const child of item) stack.push([child, depth + 1])
  }
  return deepest
}

/** A join tree of at most MAX_SECTIONS sections is at most that deep; deeper is refused unread. */
const boundedJoinTree = z.preprocess((value, context) => {
  if (nestingDepth(value, MAX_SECTIONS) > MAX_SECTIONS) {
    context.addIssue({ code: 'custom', message: `at most ${MAX_SECTIONS} levels of joins (one per section)`, input: value })
  }
  return value
}, joinTree)

const handSetOrder = z
  .strictObject({
    sections: list(z.strictObject({ label: id, areas: list(point, MAX_AREAS, 'areas').min(1) }), MAX_SECTIONS, 'sections').min(1),
    assembly: boundedJoinTree.nullable().optional(),
  })
  .superRefine((order, context) => {
    const areas = order.sections.reduce((sum, section) => sum + section.areas.length, 0)
    if (areas > MAX_AREAS) context.addIssue({ code: 'custom', path: ['sections'], message: `at most ${MAX_AREAS} areas in all sections together` })
  })

/**
 * Radii above this are refused: no quilt ring is that large, and the outline's chord count grows
 * with the radius (a runaway value would make an outline of millions of chords). File units.
 */
const MAXIMUM_RADIUS = 1000

const ring = z
  .strictObject({
    innerRadius: finite.min(0).max(MAXIMUM_RADIUS),
    outerRadius: positive.max(MAXIMUM_RADIUS),
    repeats: z.number().int().min(MIN_REPEATS).max(MAX_REPEATS),
    repeatMode: z.enum(['rotate', 'mirror']),
  })
  .superRefine((value, context) => {
    if (value.innerRadius >= value.outerRadius) {
      context.addIssue({ code: 'custom', path: ['innerRadius'], message: 'the inner radius must be smaller than the outer radius' })
    }
    // Alternate mirroring only closes up around the ring when the repeats pair off.
    if (value.repeatMode === 'mirror' && value.repeats % 2 !== 0) {
      context.addIssue({ code: 'custom', path: ['repeatMode'], message: 'mirrored repeats need an even number of repeats' })
    }
  })

/**
 * The schema of a version 2 design file. Unknown keys are rejected, each issue carries the path of
 * the offending field.
 */
const designFileV2Schema = z
  .strictObject({
    format: z.literal('wreathwright-design'),
    version: z.literal(2),
    name: text({ max: MAX_NAME_LENGTH, min: 0 }),
    units: z.enum(['in', 'cm']),
    ring,
    seams: list(seam, MAX_SEAMS, 'seams'),
    fills: list(fill, MAX_AREAS, 'fills').optional(),
    leaves: list(leaf, MAX_LEAVES, 'leaves').optional(),
    stems: list(stem, MAX_STEMS, 'stems').optional(),
    berries: list(berry, MAX_BERRIES, 'berries').optional(),
    curls: list(curl, MAX_CURLS, 'curls').optional(),
    colorways: list(colorway, MAX_COLORWAYS, 'colourways').optional(),
    order: handSetOrder.nullable().optional(),
    binding: binding.optional(),
  })
  .superRefine((file, context) => {
    const seamIds = new Set<string>()
    file.seams.forEach((s, index) => {
      if (seamIds.has(s.id)) context.addIssue({ code: 'custom', path: ['seams', index, 'id'], message: `seam id "${s.id}" is used twice` })
      seamIds.add(s.id)
    })
    const leafIds = new Set<string>()
    ;(file.leaves ?? []).forEach((l, index) => {
      if (!seamIds.has(l.seam)) {
        context.addIssue({ code: 'custom', path: ['leaves', index, 'seam'], message: `no seam has the id "${l.seam}"` })
      }
      if (leafIds.has(l.id)) context.addIssue({ code: 'custom', path: ['leaves', index, 'id'], message: `leaf id "${l.id}" is used twice` })
      if (l.layerOffsets && l.layerOffsets.length !== l.layers.length) {
        context.addIssue({ code: 'custom', path: ['leaves', index, 'layerOffsets'], message: `give one offset per layer: ${l.layers.length} layers, ${l.layerOffsets.length} offsets` })
      }
      leafIds.add(l.id)
    })
    const labels = new Set<string>()
    ;(file.order?.sections ?? []).forEach((section, index) => {
      if (labels.has(section.label)) {
        context.addIssue({ code: 'custom', path: ['order', 'sections', index, 'label'], message: `section "${section.label}" is named twice` })
      }
      labels.add(section.label)
    })
    const colorwayNames = new Set<string>()
    ;(file.colorways ?? []).forEach((c, index) => {
      if (colorwayNames.has(c.name)) context.addIssue({ code: 'custom', path: ['colorways', index, 'name'], message: `colourway "${c.name}" is named twice` })
      colorwayNames.add(c.name)
    })
  })

const isRecord = (value: unknown): value is Record<string, unknown> => typeof value === 'object' && value !== null && !Array.isArray(value)

/**
 * A version 1 file as version 2, before validation; anything else is returned as it is. Version 1
 * gave each role of a colourway only its colour: the fabric takes the role in words as its name
 * ("leaf-dark" → "Leaf dark") and that colour (a wrong colour is still refused, at
 * `colorways.0.fabrics.<role>.color`). Nothing else changed between the versions.
 *
 * @example (upgradeDesignFile({ version: 1, colorways: [{ name: 'Holly', fabrics: { 'leaf-dark': '#2f5540' } }] }) as { colorways: unknown }).colorways // [{ name: 'Holly', fabrics: { 'leaf-dark': { name: 'Leaf dark', color: '#2f5540' } } }]
 */
export function upgradeDesignFile(json: unknown): unknown {
  if (!isRecord(json) || json.version !== 1) return json
  const { colorways, ...rest } = json
  if (!Array.isArray(colorways)) return { ...rest, version: 2, ...(colorways !== undefined && { colorways }) }
  return {
    ...rest,
    version: 2,
    colorways: colorways.map((c: unknown) =>
      isRecord(c) && isRecord(c.fabrics)
        ? { ...c, fabrics: Object.fromEntries(Object.entries(c.fabrics).map(([fabric, color]) => [fabric, { name: fabricRoleInWords(fabric), color }])) }
        : c,
    ),
  }
}

/** A swatch as files of the first version 2 named it: the image's key in the object store. */
const LEGACY_UPLOAD_KEY = /^(?!\/)(?!.*\.\.)[A-Za-z0-9!_.*'()/-]+$/
/** The upload id inside such a key: the upload route stores an image as `…/<id>.<jpg|png|webp>`. */
const ID_IN_LEGACY_KEY = /\/([0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12})\.(?:jpg|png|webp)$/i

/**
 * A swatch as the schema now reads it. An object-store key (it has a `/` or a `.`, which no
 * upload id has) becomes the upload id it names, or is dropped when it names none: no address
 * ever served an image by its key, so nothing that could be shown is lost. Anything else (an id,
 * or not a string at all) is left for the schema to accept or refuse.
 *
 * @example swatchFromLegacyKey('designs/uploads/u1/swatch/6f1c2b3a-0d4e-4f5a-8b6c-7d8e9f0a1b2c.webp') // '6f1c2b3a-0d4e-4f5a-8b6c-7d8e9f0a1b2c'
 * @example swatchFromLegacyKey('uploads/u1/holly.webp') // undefined
 */
export function swatchFromLegacyKey(swatch: unknown): unknown {
  if (typeof swatch !== 'string' || !/[/.]/.test(swatch) || swatch.length > MAX_UPLOAD_KEY_LENGTH || !LEGACY_UPLOAD_KEY.test(swatch)) return swatch
  return ID_IN_LEGACY_KEY.exec(`/${swatch}`)?.[1]?.toLowerCase()
}

/** Every swatch of a (version 2) file through `swatchFromLegacyKey`; the same value when none changes. */
function readLegacySwatches(json: unknown): unknown {
  if (!isRecord(json) || !Array.isArray(json.colorways)) return json
  let changed = false
  const colorways = json.colorways.map((c: unknown) => {
    if (!isRecord(c) || !isRecord(c.fabrics)) return c
    const fabrics = Object.fromEntries(
      Object.entries(c.fabrics).map(([role, f]) => {
        if (!isRecord(f) || !('swatch' in f)) return [role, f]
        const swatch = swatchFromLegacyKey(f.swatch)
        if (swatch === f.swatch) return [role, f]
        changed = true
        const { swatch: _old, ...rest } = f
        return [role, swatch === undefined ? rest : { ...rest, swatch }]
      }),
    )
    return { ...c, fabrics }
  })
  return changed ? { ...json, colorways } : json
}

/**
 * The schema of a design file: version 2, or version 1 upgraded to version 2 on the way in
 * (`upgradeDesignFile`), swatches named by an object-store key read as upload ids
 * (`swatchFromLegacyKey`). Its output is always version 2.
 *
 * @example designFileSchema.safeParse(JSON.parse(text)).success
 */
export const designFileSchema = z.preprocess((json) => readLegacySwatches(upgradeDesignFile(json)), designFileV2Schema)

/** A design file as written on disk (in its own units), version 2. */
export type DesignFile = z.infer<typeof designFileSchema>
/** What a colourway gives one role: `{ name, color, swatch? }`, the swatch an upload id. */
export type ColorwayFabric = z.infer<typeof colorwayFabricSchema>

/** One reason a file is not a valid design, with the dotted path of the field, e.g. `ring.outerRadius`. */
export interface DesignIssue {
  readonly path: string
  readonly message: string
}

export type ParseDesignResult =
  | { readonly ok: true; readonly design: Design; readonly file: DesignFile }
  | { readonly ok: false; readonly issues: readonly DesignIssue[] }

/**
 * Validates a parsed JSON value as a design file and converts it to the core's inches `Design`.
 *
 * @example
 * const result = parseDesign(JSON.parse(text))
 * if (!result.ok) console.error(result.issues[0]?.path, result.issues[0]?.message)
 */
export function parseDesign(json: unknown): ParseDesignResult {
  const parsed = designFileSchema.safeParse(json)
  if (!parsed.success) {
    return {
      ok: false,
      issues: parsed.error.issues.map((issue) => ({
        path: issue.path.map(String).join('.') || '(root)',
        message: issue.message,
      })),
    }
  }
  return { ok: true, design: toInchesDesign(parsed.data), file: parsed.data }
}

/**
 * Formats an issue as one line: `ring.outerRadius: Too small: expected number to be >0`.
 *
 * @example formatDesignIssue({ path: 'ring.repeats', message: 'Too big' }) // 'ring.repeats: Too big'
 */
export function formatDesignIssue(issue: DesignIssue): string {
  return `${issue.path}: ${issue.message}`
}

function toInchesDesign(original: DesignFile): Design {
  // Every length goes through the one scaler; below, the file's lists only get their defaults.
  const file = original.units === 'cm' ? scaleDesignLengths(original, 1 / CENTIMETRES_PER_INCH) : original
  const at = (p: readonly [number, number]): Point => [p[0], p[1]]
  const order: HandSetOrder | null = file.order
    ? {
        sections: file.order.sections.map((s) => ({ label: s.label, areas: s.areas.map(at) })),
        assembly: file.order.assembly ?? null,
      }
    : null
  return {
    name: file.name,
    ring: {
      innerRadius: file.ring.innerRadius,
      outerRadius: file.ring.outerRadius,
      repeats: file.ring.repeats,
      repeatMode: file.ring.repeatMode,
    },
    seams: file.seams.map((s) => ({ id: s.id, from: at(s.from), to: at(s.to) })),
    fills: (file.fills ?? []).map((f) => ({ at: at(f.at), fabric: f.fabric })),
    leaves: (file.leaves ?? []).map((l) => ({
      id: l.id,
      seam: l.seam,
      at: l.at,
      side: l.side,
      angle: l.angle ?? 0,
      length: l.length,
      width: l.width,
      layers: [...l.layers],
      ...(l.layerOffsets && { layerOffsets: l.layerOffsets.map((offset) => ({ ...offset })) }),
    })),
    stems: (file.stems ?? []).map((s) => ({ radius: s.radius, finishedWidth: s.finishedWidth, fabric: s.fabric })),
    berries: (file.berries ?? []).map((b) => ({ at: at(b.at), finishedDiameter: b.finishedDiameter, fabric: b.fabric })),
    curls: (file.curls ?? []).map((c) => ({ points: c.points.map(at) })),
    colorways: (file.colorways ?? []).map((c) => ({
      name: c.name,
      fabrics: Object.fromEntries(Object.entries(c.fabrics).map(([fabric, f]) => [fabric, { ...f }])),
    })),
    order,
    ...(file.binding && { binding: { ...file.binding } }),
  }
}
