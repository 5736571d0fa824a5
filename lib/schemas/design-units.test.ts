/**
 * Every length of a design is scaled by the one scaler (geometry/design-lengths.ts): reading a
 * centimetre file, switching units on the board and resizing a design. The design below fills
 * every field the schema knows, and the walk compares every number with its expected value, so a
 * length field added to the schema but not to the scaler fails here, and so does a field added
 * to the schema but not to this design.
 */
import { describe, expect, it } from 'vitest'
import type { z } from 'zod'
import { scaleDesign } from '@/geometry/symmetry'
import { commands, normalizeDesign } from '@/lib/board/commands'
import { CENTIMETRES_PER_INCH } from '@/lib/units'
import { designFileSchema, parseDesign, type DesignFile } from './design'

/**
 * Numbers of a design that are not lengths and must never be scaled. Paths as `walk` writes
 * them (`[]` for any list element). Add a new unitless number here, a new length to the scaler.
 */
const NOT_LENGTHS = new Set([
  'version', // the file format's version
  'ring.repeats', // a count
  'leaves[].at', // a fraction of the seam's length
  'leaves[].angle', // degrees
  'leaves[].layerOffsets[].turn', // degrees
  'leaves[].layerOffsets[].scale', // a ratio
])

/** A design in inches with every field the schema knows filled in (and every list non-empty). */
const everyField: DesignFile = {
  format: 'wreathwright-design',
  version: 2,
  name: 'Every field',
  units: 'in',
  ring: { innerRadius: 3, outerRadius: 9, repeats: 4, repeatMode: 'mirror' },
  seams: [
    { id: 's1', from: [4, 0], to: [0, 4.5] },
    { id: 's2', from: [5, 0.25], to: [6.5, 6.5] },
  ],
  fills: [{ at: [5.5, 1], fabric: 'background' }],
  leaves: [{ id: 'leaf-1', seam: 's1', at: 0.4, side: 'left', angle: 30, length: 2.5, width: 1.25, layers: ['green', 'rust'], layerOffsets: [{}, { turn: -15, scale: 0.85 }] }],
  stems: [{ radius: 6.75, finishedWidth: 0.375, fabric: 'stem' }],
  berries: [{ at: [7, 2], finishedDiameter: 0.75, fabric: 'berry' }],
  curls: [{ points: [[6, 3], [6.5, 3.5], [7, 3.25]] }],
  colorways: [{
    name: 'Main',
    fabrics: { background: { name: 'Cream tone-on-tone', color: '#f4efe6', swatch: '0b6e4a1c-3f2d-4c8e-9a71-5d2e8f4b6c10' }, green: { name: 'Holly green batik', color: '#2f5540' } },
    themePhoto: '7c1d9e35-8a42-4f06-b3e1-2a9c5d7f8e04',
  }],
  order: {
    sections: [{ label: 'A', areas: [[5.5, 1], [3.5, 3.5]] }, { label: 'B', areas: [[7.5, 4]] }],
    assembly: ['A', 'B'],
  },
  binding: { cutWidth: 2.25, fabric: 'binding' },
}

interface NumberAt {
  readonly path: string
  readonly value: number
}

/** Every number in a value with its path, e.g. `{ path: 'seams[].from[]', value: 4 }`. */
function numbers(value: unknown, path = ''): NumberAt[] {
  if (typeof value === 'number') return [{ path, value }]
  if (Array.isArray(value)) return value.flatMap((item) => numbers(item, `${path}[]`))
  if (value && typeof value === 'object') {
    return Object.entries(value).flatMap(([key, item]) => numbers(item, path ? `${path}.${key}` : key))
  }
  return []
}

/** Every path to a field in a value (objects and lists, down to their leaves). */
function paths(value: unknown, path = ''): string[] {
  if (Array.isArray(value)) return [path, ...value.flatMap((item) => paths(item, `${path}[]`))]
  if (value && typeof value === 'object') {
    return [path, ...Object.entries(value).flatMap(([key, item]) => paths(item, path ? `${path}.${key}` : key))]
  }
  return [path]
}

/** Every field path the schema knows, down to numbers, strings, records and recursive trees. */
function schemaPaths(schema: z.ZodType, path = ''): string[] {
  const def = (schema as unknown as { _zod: { def: Record<string, unknown> & { type: string } } })._zod.def
  switch (def.type) {
    case 'object':
      return Object.entries(def.shape as Record<string, z.ZodType>).flatMap(([key, field]) => schemaPaths(field, path ? `${path}.${key}` : key))
    case 'optional':
    case 'nullable':
      return schemaPaths(def.innerType as z.ZodType, path)
    case 'array':
      return schemaPaths(def.element as z.ZodType, `${path}[]`)
    case 'pipe':
      // The file schema upgrades a version 1 file first: its fields are those of the output.
      return schemaPaths(def.out as z.ZodType, path)
    case 'record':
      // A colourway's fabrics, keyed by role: `colorways[].fabrics.*.name`.
      return schemaPaths(def.valueType as z.ZodType, `${path}.*`)
    case 'tuple':
      return (def.items as z.ZodType[]).flatMap((item) => schemaPaths(item, `${path}[]`))
    default:
      // number, string, enum, literal, lazy (the join tree of labels)
      return [path]
  }
}

/** Checks that every number of `scaled` is the one of `original` times `factor`, or kept when unitless. */
function expectScaled(original: unknown, scaled: unknown, factor: number, digits: number) {
  const before = numbers(original)
  const after = numbers(scaled)
  expect(after.map((n) => n.path)).toEqual(before.map((n) => n.path))
  before.forEach((number, index) => {
    const expected = NOT_LENGTHS.has(number.path) ? number.value : number.value * factor
    const actual = after[index]!.value
    if (Math.abs(actual - expected) > 10 ** -digits) {
      throw new Error(`${number.path}: expected ${expected} (${number.value}${NOT_LENGTHS.has(number.path) ? ', not a length' : ` × ${factor}`}), got ${actual}`)
    }
  })
}

describe('one scaler for every length of a design', () => {
  it('has a test design that fills every field of the schema', () => {
    // Any fabric role stands for the record's keys.
    const filled = new Set(paths(everyField).map((path) => path.replace(/\.fabrics\.[^.]+/, '.fabrics.*')))
    const missing = schemaPaths(designFileSchema).filter((path) => !filled.has(path))
    // A field added to the schema goes into `everyField` too, so the walks below see it.
    expect(missing).toEqual([])
    expect(designFileSchema.safeParse(everyField).success).toBe(true)
  })

  it('switches the board to centimetres and back, scaling every length (1 in = 2.54 cm exactly, 1959 agreement)', () => {
    const inches = normalizeDesign(everyField)
    const centimetres = commands.setUnits.run(inches, { units: 'cm' })
    expect(centimetres.units).toBe('cm')
    // The board rounds lengths to 1/10,000 of its unit.
    expectScaled({ ...inches, units: null }, { ...centimetres, units: null }, CENTIMETRES_PER_INCH, 4)
    const back = commands.setUnits.run(centimetres, { units: 'in' })
    expect(back.units).toBe('in')
    expectScaled({ ...inches, units: null }, { ...back, units: null }, 1, 4)
  })

  it('reads a centimetre file as the same design in inches', () => {
    const inchFile = parseDesign(everyField)
    const centimetreFile = commands.setUnits.run(normalizeDesign(everyField), { units: 'cm' })
    const fromCentimetres = parseDesign(centimetreFile)
    if (!inchFile.ok || !fromCentimetres.ok) throw new Error('the test design must parse')
    expectScaled(inchFile.design, fromCentimetres.design, 1, 4)
  })

  it('resizes a design to another finished diameter, scaling every length', () => {
    const parsed = parseDesign(everyField)
    if (!parsed.ok) throw new Error('the test design must parse')
    // 18 in finished diameter (outer radius 9 in) to 27 in: every length × 1.5
    expectScaled(parsed.design, scaleDesign(parsed.design, 27), 1.5, 12)
  })

  it('fails for a length the scaler leaves alone', () => {
    const inches = normalizeDesign(everyField)
    const centimetres = commands.setUnits.run(inches, { units: 'cm' })
    const forgotten = { ...centimetres, stems: inches.stems }
    expect(() => expectScaled({ ...inches, units: null }, { ...forgotten, units: null }, CENTIMETRES_PER_INCH, 4)).toThrow(/stems\[\]\.radius/)
  })
})
