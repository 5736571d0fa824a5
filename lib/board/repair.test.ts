import { existsSync, readdirSync, readFileSync } from 'node:fs'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import type { Seam, Suggestion } from '@/geometry'
import { DEMO_PATTERNS } from '@/scripts/demo-data'
import { DEMO_SEASON_PATTERNS } from '@/scripts/demo-season'
import { emptyDesign } from '@/lib/new-design'
import { parseDesign, type DesignFile } from '@/lib/schemas/design'
import { boardPlan, boardSuggestions, suggestedLeavesInDesignUnits, suggestedSeamsInDesignUnits } from './board-plan'
import { commands, normalizeDesign, type BoardDesign } from './commands'
import { repairPreview, seamChanges } from './repair-ghost'
import { createBoardStore, design as designOf } from './store'

/**
 * A quarter ring 18 in across with a Y: three seams meet at (3, 3), none continuing another.
 * s1 runs to the straight edge at (6, 0), s2 to the other edge at (0, 4), s3 to the arc; a leaf
 * lies on s3.
 */
function yJunction(overrides: Partial<DesignFile> = {}): DesignFile {
  return {
    ...emptyDesign('Y junction'),
    seams: [
      { id: 's1', from: [3, 3], to: [6, 0] },
      { id: 's2', from: [3, 3], to: [0, 4] },
      { id: 's3', from: [3, 3], to: [6.364, 6.364] },
    ],
    leaves: [{ id: 'l1', seam: 's3', at: 0.5, side: 'left', angle: 0, length: 1.5, width: 0.75, layers: ['background'] }],
    ...overrides,
  }
}

/** The design's seams in the core's inches, as the repair search returns them. */
function coreSeams(design: BoardDesign): Seam[] {
  const parsed = parseDesign(design)
  if (!parsed.ok) throw new Error('a valid design')
  return [...parsed.design.seams]
}

/**
 * A suggestion as the core would write it: s2's far end moved from (0, 4) to (0, 6) in, onto
 * s1's line x + y = 6, so s1 and s2 make one straight seam and s3 meets it in a T.
 * Moved 6 − 4 = 2 in; nothing added.
 */
function continueS1(design: BoardDesign): Suggestion {
  const seams = coreSeams(design).map((seam) => (seam.id === 's2' ? { ...seam, to: [0, 6] as const } : seam))
  return { message: 'Move the end of seam s2 to continue seam s1: sews in 1 section', seams, sections: 1, addedLengthIn: 0, movedIn: 2 }
}

describe('applying a suggested repair', () => {
  it('replaces the seams as one undo step that makes the design sewable, and undo gives them back exactly', () => {
    const store = createBoardStore(yJunction())
    const before = designOf(store.getState())
    expect(boardPlan(before).plan?.sewable).toBe(false)

    store.run('applyRepair', { seams: continueS1(before).seams })
    const after = designOf(store.getState())
    expect(after.seams).toEqual([
      { id: 's1', from: [3, 3], to: [6, 0] },
      { id: 's2', from: [3, 3], to: [0, 6] },
      { id: 's3', from: [3, 3], to: [6.364, 6.364] },
    ])
    // The leaf keeps its seam and its place along it.
    expect(after.leaves).toEqual(before.leaves)
    expect(boardPlan(after).plan).toMatchObject({ sewable: true, sections: [expect.anything()] })
    expect(store.getState().history.past).toHaveLength(1)

    store.undo()
    expect(designOf(store.getState())).toBe(before)
    expect(designOf(store.getState()).seams).toEqual(yJunction().seams)
    store.redo()
    expect(designOf(store.getState())).toBe(after)
  })

  it('keeps every seam id and the untouched seams as they were, and adds a new seam with its own id', () => {
    const design = normalizeDesign(yJunction())
    const seams = [...coreSeams(design), { id: 's4', from: [0, 2] as const, to: [2, 0] as const }]
    const next = commands.applyRepair.run(design, { seams })
    expect(next.seams.map((seam) => seam.id)).toEqual(['s1', 's2', 's3', 's4'])
    next.seams.slice(0, 3).forEach((seam, index) => expect(seam).toEqual(design.seams[index]))
  })

  it('converts a centimetre design’s suggestion from inches with the exact factor and leaves the other ends bit for bit', () => {
    const inCentimetres = commands.setUnits.run(normalizeDesign(yJunction()), { units: 'cm' })
    const store = createBoardStore(inCentimetres)
    const before = designOf(store.getState())
    store.run('applyRepair', { seams: continueS1(inCentimetres).seams })
    const seams = designOf(store.getState()).seams
    // 6 in × 2.54 cm/in = 15.24 cm (1 in = 2.54 cm exactly: international yard and pound agreement, 1959).
    expect(seams[1]).toEqual({ id: 's2', from: inCentimetres.seams[1]!.from, to: [0, 15.24] })
    // s1 and s3 went to inches and back (÷ 2.54 × 2.54): still the very numbers the design held.
    expect(seams[0]).toBe(inCentimetres.seams[0])
    expect(seams[2]).toEqual(inCentimetres.seams[2])
    expect(seams[2]!.to).toEqual(inCentimetres.seams[2]!.to)
    store.undo()
    expect(designOf(store.getState())).toBe(before)
    expect(designOf(store.getState()).seams).toEqual(inCentimetres.seams)
  })

  it('records nothing for a suggestion that changes nothing', () => {
    const store = createBoardStore(yJunction())
    store.run('applyRepair', { seams: coreSeams(designOf(store.getState())) })
    expect(store.getState().history.past).toHaveLength(0)
  })

  it('drops an order set by hand: the suggestion counts the sections of the proposed order', () => {
    const design = normalizeDesign(yJunction({ order: { sections: [{ label: 'A', areas: [[1, 1]] }], assembly: null } }))
    expect(commands.applyRepair.run(design, { seams: continueS1(design).seams }).order).toBeNull()
  })
})

describe('converting a suggestion’s seams to the design’s units', () => {
  it('multiplies by 2.54 for centimetres and rounds as the board’s commands do', () => {
    // 1 in = 2.54 cm; 1/3 in = 0.846666… cm, kept to 1/10 000 as every command keeps a seam end.
    expect(suggestedSeamsInDesignUnits({ units: 'cm', seams: [] }, [{ id: 's1', from: [1, 0], to: [1 / 3, 2] }])).toEqual([
      { id: 's1', from: [2.54, 0], to: [0.8467, 5.08] },
    ])
  })
})

describe('the ghost of a suggestion', () => {
  it('lists the seams that are new or whose ends moved, with where they lie now, and the removed ones', () => {
    const before = [
      { id: 's1', from: [0, 0], to: [1, 0] },
      { id: 's2', from: [0, 1], to: [1, 1] },
      { id: 's3', from: [0, 2], to: [1, 2] },
    ] as DesignFile['seams']
    const after = [
      { id: 's1', from: [0, 0], to: [1, 0] },
      { id: 's2', from: [0, 1], to: [2, 1] },
      { id: 's4', from: [0, 3], to: [1, 3] },
    ] as DesignFile['seams']
    expect(seamChanges(before, after)).toEqual([
      { id: 's2', before: [[0, 1], [1, 1]], after: [[0, 1], [2, 1]] },
      { id: 's4', before: null, after: [[0, 3], [1, 3]] },
      { id: 's3', before: [[0, 2], [1, 2]], after: null },
    ])
  })

  it('shows only the moved seam of a suggestion in centimetres, and goes away when the design changes', () => {
    const design = commands.setUnits.run(normalizeDesign(yJunction()), { units: 'cm' })
    const seams = suggestedSeamsInDesignUnits(design, continueS1(design).seams)
    const preview = repairPreview(design, seams, 0)
    expect(preview.changes.map((change) => change.id)).toEqual(['s2'])
    expect(preview.changes[0]!.after![1]).toEqual([0, 15.24])

    const store = createBoardStore(design)
    store.showRepair(repairPreview(designOf(store.getState()), seams, 0))
    expect(store.getState().shownRepair?.index).toBe(0)
    // Hover is never recorded.
    expect(store.getState().history.past).toHaveLength(0)
    store.run('applyRepair', { seams: continueS1(design).seams })
    expect(store.getState().shownRepair).toBeNull()
  })
})

const fixtures = join(import.meta.dirname, '..', '..', 'geometry', 'fixtures')
const fixtureFile = (name: string): DesignFile => JSON.parse(readFileSync(join(fixtures, name, 'design.json'), 'utf8')) as DesignFile

describe('a wrong hand-set order and an impossible leaf on the board', () => {
  it('lets Wreathwright choose the order: the seams kept, the hand-set order dropped, one undo step', () => {
    const store = createBoardStore(fixtureFile('hand-set-order-two-lines'))
    const before = designOf(store.getState())
    expect(before.order).not.toBeNull()
    const [first] = boardSuggestions(before).suggestions
    expect(first?.suggestion.message).toBe('Let Wreathwright choose the order: sews in 1 section')
    expect(first?.suggestion.clearsOrder).toBe(true)
    const { seams, leaves, clearsOrder } = first!.suggestion
    store.run('applyRepair', { seams, leaves, clearsOrder })
    const after = designOf(store.getState())
    expect(after.order).toBeNull()
    expect(after.seams).toBe(before.seams)
    expect(boardPlan(after).plan).toMatchObject({ sewable: true, sections: [expect.anything()] })
    expect(store.getState().history.past).toHaveLength(1)
    store.undo()
    expect(designOf(store.getState())).toBe(before)
  })

  it('resizes a leaf too wide for its length, names it as the plan does, and draws it as a ghost', () => {
    const design = normalizeDesign(fixtureFile('leaf-too-wide-for-its-length'))
    const found = boardSuggestions(design).suggestions
    expect(found.map((entry) => entry.suggestion.message)).toEqual([
      'Lengthen leaf 1 from 0.5 in to 1.625 in: sews in 1 section',
      'Narrow leaf 1 from 3 in to 0.875 in wide: sews in 1 section',
    ])
    expect(found[0]!.leaves[0]).toEqual({ ...design.leaves[0], length: 1.625 })
    const preview = repairPreview(design, found[0]!.seams, 0, found[0]!.leaves)
    expect(preview.changes).toEqual([])
    expect(preview.resizedLeaves.map((leaf) => [leaf.id, leaf.length, leaf.width])).toEqual([['stubby', 1.625, 3]])

    const store = createBoardStore(design)
    const { seams, leaves, clearsOrder } = found[0]!.suggestion
    store.run('applyRepair', { seams, leaves, clearsOrder })
    const after = designOf(store.getState())
    expect(after.leaves).toEqual([{ ...design.leaves[0], length: 1.625 }])
    expect(after.seams).toBe(design.seams)
    expect(boardPlan(after).plan?.sewable).toBe(true)
    store.undo()
    expect(designOf(store.getState()).leaves).toEqual(design.leaves)
  })

  it('converts a resized leaf to centimetres with the exact factor, other leaves untouched', () => {
    const other = { id: 'fine', seam: 'band', at: 0.2, side: 'left' as const, angle: 0, length: 1.27 * 2.54, width: 0.5, layers: ['leaf-dark'] }
    const design = { units: 'cm' as const, leaves: [{ id: 'stubby', seam: 'band', at: 0.5, side: 'right' as const, angle: 0, length: 1.27, width: 7.62, layers: ['leaf-dark'] }, other] }
    const next = suggestedLeavesInDesignUnits(design, [{ ...design.leaves[0]!, length: 1.625, width: 3 }, { ...other, length: other.length / 2.54, width: other.width / 2.54 }])
    // 1.625 in × 2.54 = 4.1275 cm; 3 in = 7.62 cm, as it was.
    expect(next[0]).toEqual({ ...design.leaves[0], length: 4.1275 })
    expect(next[1]).toBe(other)
  })

  it('keeps a hand-set order when only a leaf is resized', () => {
    const design = normalizeDesign({ ...fixtureFile('leaf-too-wide-for-its-length'), order: { sections: [{ label: 'A', areas: [[1, 1], [6, 6]] }] } })
    const leaves = [{ ...design.leaves[0]!, angle: 0, length: 1.625 }]
    const next = commands.applyRepair.run(design, { seams: coreSeams(design), leaves })
    expect(next.order).toBe(design.order)
    expect(next.leaves[0]!.length).toBe(1.625)
  })

  // Done when (issue 16): every unsewable demo or fixture design gets a working suggestion on the board.
  const designs: [string, DesignFile][] = [
    ...DEMO_PATTERNS.map((pattern): [string, DesignFile] => [`demo ${pattern.design.name}`, pattern.design]),
    ...DEMO_SEASON_PATTERNS.map((pattern): [string, DesignFile] => [`demo ${pattern.design.name}`, pattern.design]),
    ...readdirSync(fixtures)
      .filter((name) => existsSync(join(fixtures, name, 'design.json')))
      .map((name): [string, DesignFile] => [`fixture ${name}`, fixtureFile(name)]),
  ]
  for (const [name, file] of designs) {
    const design = normalizeDesign(file)
    if (boardPlan(design).plan?.sewable !== false) continue
    it(`applies the first suggestion for the unsewable ${name} and the board's plan then sews as it says`, () => {
      const store = createBoardStore(file)
      const before = designOf(store.getState())
      const [first] = boardSuggestions(before).suggestions
      expect(first, name).toBeDefined()
      const { seams, leaves, clearsOrder, sections } = first!.suggestion
      store.run('applyRepair', { seams, leaves, clearsOrder })
      const plan = boardPlan(designOf(store.getState())).plan
      expect(plan?.sewable, first!.suggestion.message).toBe(true)
      expect(plan?.sections.length).toBe(sections)
      expect(store.getState().history.past).toHaveLength(1)
    })
  }
})
