import { describe, expect, it } from 'vitest'
import { emptyDesign } from '@/lib/new-design'
import { areaAt, boardPlan } from './board-plan'
import { commands, normalizeDesign, type BoardDesign } from './commands'

/** A quarter ring 18 in across with two seams, one dangling end (a problem to mark) and a fill. */
const inches: BoardDesign = normalizeDesign({
  ...emptyDesign('Units'),
  seams: [
    { id: 's1', from: [6, 0], to: [0, 6] },
    { id: 's2', from: [3, 3], to: [2, 1] }, // ends in the middle of an area: the plan marks it
  ],
  fills: [{ at: [1, 1], fabric: 'background' }],
})
const centimetres = commands.setUnits.run(inches, { units: 'cm' })

// 1 in = 2.54 cm exactly (standard: international yard and pound agreement, 1959)
const toCentimetres = (points: readonly (readonly [number, number])[]) => points.map(([x, y]) => [x * 2.54, y * 2.54])

describe('the board plan in the design’s own units', () => {
  it('gives every area, step and problem of a centimetre design in centimetres, converted once', () => {
    const planInInches = boardPlan(inches)
    const planInCentimetres = boardPlan(centimetres)
    expect(planInCentimetres.areas).toHaveLength(planInInches.areas.length)
    planInInches.areas.forEach((area, index) => {
      const converted = planInCentimetres.areas[index]!
      expect(converted.polygon.flat()).toEqual(toCentimetres(area.polygon).flat().map((value) => expect.closeTo(value, 3)))
      expect(converted.labelAt.map((v) => v / 2.54)).toEqual(area.labelAt.map((value) => expect.closeTo(value, 3)))
      expect(converted.roughCutPlaced.flat()).toEqual(toCentimetres(area.roughCutPlaced).flat().map((value) => expect.closeTo(value, 3)))
      // The texts keep the core's inches: a rough cut is the same piece of fabric in either unit.
      expect(converted.planned.roughCut.widthIn).toBeCloseTo(area.planned.roughCut.widthIn, 6)
      expect(converted.fabric).toBe(area.fabric)
    })
    expect(planInCentimetres.steps.map((area) => area.label)).toEqual(planInInches.steps.map((area) => area.label))
    expect(planInInches.problems.length).toBeGreaterThan(0)
    planInInches.problems.forEach((problem, index) => {
      expect(planInCentimetres.problems[index]!.at).toEqual(toCentimetres([problem.at])[0]!.map((value) => expect.closeTo(value, 3)))
    })
  })

  it('finds the area under a point given in the design’s units', () => {
    const filled = boardPlan(inches).areas.find((area) => area.fabric === 'background')!
    expect(areaAt(boardPlan(inches), [1, 1])?.id).toBe(filled.id)
    expect(areaAt(boardPlan(centimetres), [2.54, 2.54])?.id).toBe(filled.id)
    expect(areaAt(boardPlan(centimetres), [40, 40])).toBeNull() // 40 cm is outside a 22.86 cm radius
  })
})

describe('leaves on the board', () => {
  it('are named by where they lie, in the plan and its problems, never by id', () => {
    // A leaf over the inner area of s1 and one too wide for its length (an error at the leaf).
    const design: BoardDesign = normalizeDesign({
      ...inches,
      seams: [{ id: 's1', from: [6, 0], to: [0, 6] }],
      leaves: [
        { id: 'leaf-east', seam: 's1', at: 0.5, side: 'right', angle: 0, length: 1.5, width: 0.75, layers: ['green'] },
        { id: 'stubby-one', seam: 's1', at: 0.25, side: 'right', angle: 0, length: 0.5, width: 3, layers: ['green'] },
      ],
    })
    const result = boardPlan(design)
    expect([...result.leafNames.values()].sort()).toEqual(['leaf 1', 'leaf 2'])
    const messages = result.problems.map((problem) => problem.message).join(' ')
    expect(messages).toMatch(/Leaf \d cannot be made as a pointed leaf/)
    expect(messages).not.toMatch(/leaf-east|stubby-one|\{leaf:/)
  })
})
