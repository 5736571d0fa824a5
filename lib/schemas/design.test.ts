import { describe, expect, it } from 'vitest'
import { parseDesign } from './design'

/** A valid inches design; tests override one field at a time. */
function designFile(overrides: Record<string, unknown> = {}): Record<string, unknown> {
  return {
    format: 'wreathwright-design',
    version: 1,
    name: 'Test ring',
    units: 'in',
    ring: { innerRadius: 0, outerRadius: 9, repeats: 4, repeatMode: 'rotate' },
    seams: [{ id: 's1', from: [1, 0], to: [0, 6] }],
    fills: [{ at: [0.5, 0.5], fabric: 'background' }],
    leaves: [{ id: 'l1', seam: 's1', at: 0.5, side: 'left', angle: 0, length: 1.5, width: 0.75, layers: ['dark', 'light'] }],
    order: null,
    ...overrides,
  }
}

function firstIssuePath(json: unknown): string | undefined {
  const result = parseDesign(json)
  return result.ok ? undefined : result.issues[0]?.path
}

describe('parseDesign', () => {
  it('accepts the example of geometry.md and keeps inches as they are', () => {
    const result = parseDesign(designFile())
    expect(result.ok).toBe(true)
    if (!result.ok) return
    expect(result.design.ring.outerRadius).toBe(9)
    expect(result.design.leaves[0]?.angle).toBe(0)
    expect(result.design.stems).toEqual([])
  })

  it('converts centimetres to inches once, at the edge', () => {
    const result = parseDesign(
      designFile({ units: 'cm', ring: { innerRadius: 2.54, outerRadius: 25.4, repeats: 6, repeatMode: 'mirror' }, seams: [{ id: 's1', from: [2.54, 0], to: [0, 5.08] }], leaves: [] }),
    )
    expect(result.ok).toBe(true)
    if (!result.ok) return
    // 25.4 cm / 2.54 cm per in = 10 in (standard: 1 in = 25.4 mm exactly, 1959 agreement)
    expect(result.design.ring.outerRadius).toBeCloseTo(10, 12)
    expect(result.design.ring.innerRadius).toBeCloseTo(1, 12)
    expect(result.design.seams[0]?.to[1]).toBeCloseTo(2, 12)
  })

  it('rejects unknown keys with their path', () => {
    expect(firstIssuePath(designFile({ colour: 'red' }))).toBe('(root)')
    const result = parseDesign(designFile({ ring: { innerRadius: 0, outerRadius: 9, repeats: 4, repeatMode: 'rotate', spin: 1 } }))
    expect(result.ok).toBe(false)
    if (!result.ok) expect(result.issues[0]?.path).toBe('ring')
    if (!result.ok) expect(result.issues[0]?.message).toMatch(/spin/)
  })

  it('rejects wrong types, NaN and Infinity with the path of the field', () => {
    expect(firstIssuePath(designFile({ seams: [{ id: 's1', from: [Number.NaN, 0], to: [0, 6] }] }))).toBe('seams.0.from.0')
    expect(firstIssuePath(designFile({ seams: [{ id: 's1', from: [1, 0], to: [0, Infinity] }] }))).toBe('seams.0.to.1')
    expect(firstIssuePath(designFile({ name: 5 }))).toBe('name')
  })

  it('rejects radii out of order, a negative radius and repeats outside 2–36', () => {
    expect(firstIssuePath(designFile({ ring: { innerRadius: 9, outerRadius: 3, repeats: 4, repeatMode: 'rotate' } }))).toBe('ring.innerRadius')
    expect(firstIssuePath(designFile({ ring: { innerRadius: -1, outerRadius: 3, repeats: 4, repeatMode: 'rotate' } }))).toBe('ring.innerRadius')
    expect(firstIssuePath(designFile({ ring: { innerRadius: 0, outerRadius: 3, repeats: 1, repeatMode: 'rotate' } }))).toBe('ring.repeats')
    expect(firstIssuePath(designFile({ ring: { innerRadius: 0, outerRadius: 3, repeats: 37, repeatMode: 'rotate' } }))).toBe('ring.repeats')
    expect(firstIssuePath(designFile({ ring: { innerRadius: 0, outerRadius: 3, repeats: 2.5, repeatMode: 'rotate' } }))).toBe('ring.repeats')
  })

  it('rejects a runaway radius (no quilt ring is 1000 units across its radius)', () => {
    expect(firstIssuePath(designFile({ ring: { innerRadius: 0, outerRadius: 1e12, repeats: 4, repeatMode: 'rotate' } }))).toBe('ring.outerRadius')
  })

  it('rejects mirror mode with an odd number of repeats', () => {
    expect(firstIssuePath(designFile({ ring: { innerRadius: 0, outerRadius: 3, repeats: 5, repeatMode: 'mirror' } }))).toBe('ring.repeatMode')
  })

  it('rejects units other than in and cm, and a wrong format or version', () => {
    expect(firstIssuePath(designFile({ units: 'mm' }))).toBe('units')
    expect(firstIssuePath(designFile({ version: 3 }))).toBe('version')
    expect(firstIssuePath(designFile({ version: '1' }))).toBe('version')
    expect(firstIssuePath(designFile({ format: 'other' }))).toBe('format')
  })

  it('rejects a leaf naming a seam that does not exist', () => {
    const leaves = [{ id: 'l1', seam: 's9', at: 0.5, side: 'left', length: 1, width: 0.5, layers: ['a'] }]
    const result = parseDesign(designFile({ leaves }))
    expect(result.ok).toBe(false)
    if (!result.ok) {
      expect(result.issues[0]?.path).toBe('leaves.0.seam')
      expect(result.issues[0]?.message).toContain('s9')
    }
  })

  it('rejects duplicate seam ids and non-objects', () => {
    expect(firstIssuePath(designFile({ seams: [{ id: 's1', from: [1, 0], to: [0, 6] }, { id: 's1', from: [2, 0], to: [0, 5] }], leaves: [] }))).toBe('seams.1.id')
    expect(parseDesign(null).ok).toBe(false)
    expect(parseDesign([1, 2]).ok).toBe(false)
  })

  it('accepts a hand-set order with a nested join tree', () => {
    const order = { sections: [{ label: 'A', areas: [[1, 1]] }, { label: 'B', areas: [[2, 1]] }], assembly: ['A', 'B'] }
    const result = parseDesign(designFile({ order }))
    expect(result.ok).toBe(true)
    if (result.ok) expect(result.design.order?.assembly).toEqual(['A', 'B'])
  })
})

describe('stacked leaf layers', () => {
  const leafWith = (extra: Record<string, unknown>) => designFile({ leaves: [{ id: 'l1', seam: 's1', at: 0.5, side: 'left', angle: 0, length: 1.5, width: 0.75, layers: ['dark', 'light'], ...extra }] })

  it('reads a file without layer offsets exactly as before: the layers as fabric roles, no offsets', () => {
    const result = parseDesign(designFile())
    if (!result.ok) throw new Error('the test design must parse')
    expect(result.design.leaves[0]).toEqual({ id: 'l1', seam: 's1', at: 0.5, side: 'left', angle: 0, length: 1.5, width: 0.75, layers: ['dark', 'light'] })
    expect('layerOffsets' in result.design.leaves[0]!).toBe(false)
  })

  it('keeps each layer\'s turn (degrees) and scale (a ratio) unconverted in a centimetre file', () => {
    const offsets = [{}, { turn: -12, scale: 0.8 }]
    const result = parseDesign(designFile({
      units: 'cm', ring: { innerRadius: 0, outerRadius: 22.86, repeats: 4, repeatMode: 'rotate' }, seams: [{ id: 's1', from: [2.54, 0], to: [0, 15.24] }],
      fills: [], leaves: [{ id: 'l1', seam: 's1', at: 0.5, side: 'left', length: 3.81, width: 1.905, layers: ['dark', 'light'], layerOffsets: offsets }],
    }))
    if (!result.ok) throw new Error(result.issues[0]?.message)
    expect(result.design.leaves[0]?.length).toBeCloseTo(1.5, 12)
    expect(result.design.leaves[0]?.layerOffsets).toEqual(offsets)
  })

  it('wants one offset per layer, a turn within ±45° and a scale from 1/4 to 1 1/2', () => {
    expect(firstIssuePath(leafWith({ layerOffsets: [{ turn: 5 }] }))).toBe('leaves.0.layerOffsets')
    expect(firstIssuePath(leafWith({ layerOffsets: [{}, { turn: 50 }] }))).toBe('leaves.0.layerOffsets.1.turn')
    expect(firstIssuePath(leafWith({ layerOffsets: [{}, { scale: 0 }] }))).toBe('leaves.0.layerOffsets.1.scale')
    expect(firstIssuePath(leafWith({ layerOffsets: [{}, { shift: 1 }] }))).toBe('leaves.0.layerOffsets.1')
    expect(parseDesign(leafWith({ layerOffsets: [{ turn: 0, scale: 1 }, { turn: 45, scale: 1.5 }] })).ok).toBe(true)
  })
})
