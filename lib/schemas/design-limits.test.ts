import { describe, expect, it } from 'vitest'
import {
  MAX_AREAS, MAX_BERRIES, MAX_COLORWAYS, MAX_CURLS, MAX_DESIGN_BYTES, MAX_DESIGN_FILE_BYTES, MAX_FABRICS_PER_COLORWAY, MAX_ID_LENGTH,
  MAX_LAYERS_PER_LEAF, MAX_LEAVES, MAX_NAME_LENGTH, MAX_POINTS_PER_CURL, MAX_ROLE_LENGTH, MAX_SEAMS, MAX_SECTIONS, MAX_STEMS,
} from '@/lib/limits'
import { designFileSchema, nestingDepth, parseDesign } from './design'

function designFile(overrides: Record<string, unknown> = {}): Record<string, unknown> {
  return {
    format: 'wreathwright-design',
    version: 1,
    name: 'Test ring',
    units: 'in',
    ring: { innerRadius: 0, outerRadius: 9, repeats: 4, repeatMode: 'rotate' },
    seams: [{ id: 's1', from: [1, 0], to: [0, 6] }],
    ...overrides,
  }
}

const issuesOf = (json: unknown) => {
  const result = parseDesign(json)
  return result.ok ? [] : result.issues
}

/** `count` distinct strings of exactly `length` UTF-16 units, each character 3 bytes in UTF-8 (U+8449 葉). */
const longest = (count: number, length: number) =>
  Array.from({ length: count }, (_, i) => `${i}`.padStart(6, '0') + '\u8449'.repeat(length - 6))
/** JSON.stringify writes these with 24 characters, the most it writes for any number (ECMA-262 Number::toString: 17 digits, sign, point, e-308). */
const LONG = -Number.parseFloat('2.2250738585072014e-308')
const HUGE = Number.parseFloat('2.2250738585072014e+300')
const FRACTION = Number.parseFloat('0.12345678901234568')
const point = [LONG, LONG]
/** An upload id (a UUID: always 36 characters). */
const UPLOAD_ID = '0b6e4a1c-3f2d-4c8e-9a71-5d2e8f4b6c10'

/** A design with every list at its limit and every string and number at its longest. */
function largestDesign(): Record<string, unknown> {
  const seamIds = longest(MAX_SEAMS, MAX_ID_LENGTH)
  const roles = longest(MAX_FABRICS_PER_COLORWAY, MAX_ROLE_LENGTH)
  const role = roles[0]!
  const labels = longest(MAX_SECTIONS, MAX_ID_LENGTH)
  let assembly: unknown = labels[0]
  for (const label of labels.slice(1)) assembly = [assembly, label]
  return designFile({
    name: longest(1, MAX_NAME_LENGTH)[0],
    ring: { innerRadius: 1.2345678901234567, outerRadius: 999.1234567890123, repeats: 36, repeatMode: 'mirror' },
    seams: seamIds.map((id) => ({ id, from: point, to: point })),
    fills: Array.from({ length: MAX_AREAS }, () => ({ at: point, fabric: role })),
    leaves: longest(MAX_LEAVES, MAX_ID_LENGTH).map((id, i) => ({
      id, seam: seamIds[i % MAX_SEAMS], at: FRACTION, side: 'right', angle: -74.12345678901234, length: HUGE, width: HUGE,
      layers: roles.slice(0, MAX_LAYERS_PER_LEAF), layerOffsets: Array.from({ length: MAX_LAYERS_PER_LEAF }, () => ({ turn: -1.2345678901234567, scale: 1.2345678901234567 })),
    })),
    stems: Array.from({ length: MAX_STEMS }, () => ({ radius: HUGE, finishedWidth: HUGE, fabric: role })),
    berries: Array.from({ length: MAX_BERRIES }, () => ({ at: point, finishedDiameter: HUGE, fabric: role })),
    curls: Array.from({ length: MAX_CURLS }, () => ({ points: Array.from({ length: MAX_POINTS_PER_CURL }, () => point) })),
    // Version 2: every fabric of every colourway named at the longest, with a swatch; every colourway a theme photo.
    version: 2,
    colorways: longest(MAX_COLORWAYS, MAX_NAME_LENGTH).map((name) => ({
      name,
      fabrics: Object.fromEntries(roles.map((r) => [r, { name, color: '#aabbcc', swatch: UPLOAD_ID }])),
      themePhoto: UPLOAD_ID,
    })),
    order: {
      sections: labels.map((label, i) => ({ label, areas: Array.from({ length: i < MAX_AREAS % MAX_SECTIONS ? 3 : 2 }, () => point) })),
      assembly,
    },
    binding: { cutWidth: HUGE, fabric: role },
  })
}

describe('the limits of a design (lib/limits.ts)', () => {
  it('accepts a design with every list at its limit and every string at its longest', () => {
    expect(issuesOf(largestDesign())).toEqual([])
  })

  it('keeps the largest design within MAX_DESIGN_BYTES, and an indented file within MAX_DESIGN_FILE_BYTES', () => {
    const design = largestDesign()
    const compact = Buffer.byteLength(JSON.stringify(design))
    const indented = Buffer.byteLength(JSON.stringify(design, null, 2))
    expect(compact).toBeLessThanOrEqual(MAX_DESIGN_BYTES)
    expect(indented).toBeLessThanOrEqual(MAX_DESIGN_FILE_BYTES)
    // A bound, but not a loose one: the largest design fills most of it.
    expect(compact).toBeGreaterThan(0.6 * MAX_DESIGN_BYTES)
  })

  it.each([
    ['seams', () => ({ seams: Array.from({ length: MAX_SEAMS + 1 }, (_, i) => ({ id: `s${i}`, from: [1, 0], to: [0, 6] })) }), 'seams', `at most ${MAX_SEAMS} seams`],
    ['leaves', () => ({ leaves: Array.from({ length: MAX_LEAVES + 1 }, (_, i) => ({ id: `l${i}`, seam: 's1', at: 0.5, side: 'left', length: 1, width: 0.5, layers: ['leaf'] })) }), 'leaves', `at most ${MAX_LEAVES} leaves`],
    ['layers of a leaf', () => ({ leaves: [{ id: 'l1', seam: 's1', at: 0.5, side: 'left', length: 1, width: 0.5, layers: Array(MAX_LAYERS_PER_LEAF + 1).fill('leaf') }] }), 'leaves.0.layers', `at most ${MAX_LAYERS_PER_LEAF} layers`],
    ['stems', () => ({ stems: Array(MAX_STEMS + 1).fill({ radius: 6, finishedWidth: 0.375, fabric: 'stem' }) }), 'stems', `at most ${MAX_STEMS} stems`],
    ['berries', () => ({ berries: Array(MAX_BERRIES + 1).fill({ at: [3, 5], finishedDiameter: 0.5, fabric: 'berry' }) }), 'berries', `at most ${MAX_BERRIES} berries`],
    ['curls', () => ({ curls: Array(MAX_CURLS + 1).fill({ points: [[3, 5], [3, 6]] }) }), 'curls', `at most ${MAX_CURLS} curls`],
    ['points of a curl', () => ({ curls: [{ points: Array(MAX_POINTS_PER_CURL + 1).fill([3, 5]) }] }), 'curls.0.points', `at most ${MAX_POINTS_PER_CURL} points in a curl`],
    ['fills', () => ({ fills: Array(MAX_AREAS + 1).fill({ at: [1, 1], fabric: 'background' }) }), 'fills', `at most ${MAX_AREAS} fills`],
    ['colourways', () => ({ colorways: Array.from({ length: MAX_COLORWAYS + 1 }, (_, i) => ({ name: `c${i}`, fabrics: {} })) }), 'colorways', `at most ${MAX_COLORWAYS} colourways`],
    ['fabrics of a colourway', () => ({ colorways: [{ name: 'c', fabrics: Object.fromEntries(Array.from({ length: MAX_FABRICS_PER_COLORWAY + 1 }, (_, i) => [`f${i}`, '#000000'])) }] }), 'colorways.0.fabrics', `at most ${MAX_FABRICS_PER_COLORWAY} fabrics in a colourway`],
    ['sections of an order', () => ({ order: { sections: Array.from({ length: MAX_SECTIONS + 1 }, (_, i) => ({ label: `S${i}`, areas: [[1, 1]] })) } }), 'order.sections', `at most ${MAX_SECTIONS} sections`],
    ['areas of an order', () => ({ order: { sections: [{ label: 'A', areas: Array(MAX_AREAS).fill([1, 1]) }, { label: 'B', areas: [[2, 2]] }] } }), 'order.sections', `at most ${MAX_AREAS} areas in all sections together`],
    ['a seam id', () => ({ seams: [{ id: 'x'.repeat(MAX_ID_LENGTH + 1), from: [1, 0], to: [0, 6] }] }), 'seams.0.id', `at most ${MAX_ID_LENGTH} characters`],
    ['a fabric role', () => ({ fills: [{ at: [1, 1], fabric: 'x'.repeat(MAX_ROLE_LENGTH + 1) }] }), 'fills.0.fabric', `at most ${MAX_ROLE_LENGTH} characters`],
    ['the name', () => ({ name: 'x'.repeat(MAX_NAME_LENGTH + 1) }), 'name', `at most ${MAX_NAME_LENGTH} characters`],
  ])('refuses too many %s, naming the field and the limit', (_, overrides, path, message) => {
    expect(issuesOf(designFile(overrides()))).toContainEqual({ path, message })
  })

  it('refuses a 42,000-seam design quickly, with one issue for the list, not one per seam', () => {
    const seams = Array.from({ length: 42_000 }, (_, i) => ({ id: `s${i}`, from: [Math.random() * 9, 0], to: [0, Math.random() * 9] }))
    const started = performance.now()
    const issues = issuesOf(designFile({ seams }))
    expect(issues).toEqual([{ path: 'seams', message: `at most ${MAX_SEAMS} seams` }])
    expect(performance.now() - started).toBeLessThan(2000)
  })
})

describe('strings in a design', () => {
  it.each([
    ['NUL in a seam id', { seams: [{ id: 's\u00001', from: [1, 0], to: [0, 6] }] }, 'seams.0.id'],
    ['a lone surrogate in the name', { name: 'Acorn \ud83c' }, 'name'],
    ['NUL in a fabric role', { fills: [{ at: [1, 1], fabric: 'back\u0000ground' }] }, 'fills.0.fabric'],
    ['a control character in a colourway name', { colorways: [{ name: 'Autumn\u0007', fabrics: {} }] }, 'colorways.0.name'],
    ['a lone surrogate in a fabric role of a colourway', { colorways: [{ name: 'Autumn', fabrics: { '\udfff': '#000000' } }] }, 'colorways.0.fabrics'],
    ['NUL in a section label', { order: { sections: [{ label: 'A\u0000', areas: [[1, 1]] }] } }, 'order.sections.0.label'],
  ])('refuses %s, naming the field', (_, overrides, path) => {
    expect(issuesOf(designFile(overrides)).map((issue) => issue.path)).toContainEqual(expect.stringMatching(new RegExp(`^${path.replace(/\./g, '\\.')}`)))
  })

  it('normalises ids and roles (NFC, trimmed) so that a leaf finds its seam as written', () => {
    const result = parseDesign(designFile({
      seams: [{ id: ' Cafe\u0301 ', from: [1, 0], to: [0, 6] }],
      leaves: [{ id: 'l1', seam: 'Caf\u00e9', at: 0.5, side: 'left', length: 1, width: 0.5, layers: [' leaf '] }],
    }))
    expect(result.ok && [result.file.seams[0]?.id, result.file.leaves?.[0]?.layers]).toEqual(['Caf\u00e9', ['leaf']])
  })
})

describe('the depth of a hand-set join tree', () => {
  const deep = (depth: number): unknown => {
    let tree: unknown = 'A'
    for (let i = 0; i < depth; i += 1) tree = [tree, `B${i}`]
    return tree
  }

  it('is measured without recursion', () => {
    expect(nestingDepth('A', 10)).toBe(0)
    expect(nestingDepth([['A', 'B'], 'C'], 10)).toBe(2)
    expect(nestingDepth(deep(100_000), 500)).toBe(501)
  })

  it('refuses a 5,000-deep assembly with an issue on order.assembly, not a stack overflow', () => {
    const order = { sections: [{ label: 'A', areas: [[1, 1]] }], assembly: deep(5000) }
    expect(issuesOf(designFile({ order }))).toEqual([{ path: 'order.assembly', message: `at most ${MAX_SECTIONS} levels of joins (one per section)` }])
    // The schema alone, as the API uses it, does not throw either.
    expect(() => designFileSchema.safeParse(designFile({ order: { ...order, assembly: deep(100_000) } }))).not.toThrow()
  })

  it('accepts a join tree as deep as the sections allow', () => {
    const order = { sections: [{ label: 'A', areas: [[1, 1]] }], assembly: deep(MAX_SECTIONS) }
    expect(issuesOf(designFile({ order })).filter((issue) => issue.path.startsWith('order.assembly'))).toEqual([])
  })
})
