import { describe, expect, it } from 'vitest'
import { continuousBiasSquareInches } from './bias'
import {
  BERRY_EXTRA_INCHES, berryCutDiameterInches, biasSquares, cuttingPieces, leafPieceInches, PIECES_PER_FOLDED_LEAF, UNASSIGNED_FABRIC,
} from './cutting-pieces'
import { design, quarterWedge } from './fixtures/generators'
import { leafTemplate } from './leaf-template'
import { planDesign } from './plan'
import type { Design } from './types'

const OPTIONS = { widthOfFabricIn: 40 }

/** The X crossing of geometry/README.md: four areas, the centre square rough-cut 4 × 4 in. */
const xCrossing = (overrides: Partial<Design> = {}): Design => design({
  seams: [{ id: 's1', from: [3, 0], to: [3, Math.sqrt(72)] }, { id: 's2', from: [0, 3], to: [Math.sqrt(72), 3] }],
  ...overrides,
})

describe('cuttingPieces', () => {
  it("cuts every area's rough-cut rectangle once per repeat", () => {
    const x = xCrossing({ fills: [{ at: [1.5, 1.5], fabric: 'centre' }] })
    const plan = planDesign(x)
    const pieces = cuttingPieces(x, plan, OPTIONS)
    const centre = pieces.fabrics.find((f) => f.fabric === 'centre')!
    // The 3 in square: 3 + 2 × 1/4 allowance + 2 × 1/4 margin = 4 in (README's worked example), × 4 repeats.
    expect(centre.pieces).toEqual([{ for: 'A1', widthIn: 4, heightIn: 4, count: 4 }])
    // The three areas nobody filled are cut from the "unassigned" role, each once per repeat.
    const unassigned = pieces.fabrics.find((f) => f.fabric === UNASSIGNED_FABRIC)!
    expect(unassigned.pieces.map((piece) => piece.for).sort()).toEqual(['A2', 'B1', 'B2'])
    expect(unassigned.pieces.every((piece) => piece.count === 4)).toBe(true)
    for (const area of plan.areas.filter((a) => a.label !== 'A1')) {
      expect(unassigned.pieces.find((piece) => piece.for === area.label)).toMatchObject({ widthIn: area.roughCut.widthIn, heightIn: area.roughCut.heightIn })
    }
  })

  it('cuts two pieces per folded leaf, each stacked layer a folded leaf of its own size', () => {
    const x = xCrossing({
      leaves: [{ id: 'l1', seam: 's1', at: 0.2, side: 'left', angle: 0, length: 1.5, width: 0.75, layers: ['dark', 'light'] }],
    })
    const pieces = cuttingPieces(x, planDesign(x), OPTIONS)
    // Two pieces sewn right sides together and turned make one folded leaf (common practice).
    expect(PIECES_PER_FOLDED_LEAF).toBe(2)
    // One leaf, 4 repeats: 4 folded leaves of each layer, 8 pieces each.
    expect(pieces.leaves).toEqual([{ fabric: 'dark', leaves: 4, pieces: 8 }, { fabric: 'light', leaves: 4, pieces: 8 }])
    const dark = pieces.fabrics.find((f) => f.fabric === 'dark')!.pieces
    const light = pieces.fabrics.find((f) => f.fabric === 'light')!.pieces
    expect(dark).toEqual([{ for: 'leaf', ...leafPieceInches(1.5, 0.75), count: 8 }])
    // The top layer is 10 % smaller by default: 1.35 × 0.675 in, its own template and piece.
    expect(light).toEqual([{ for: 'leaf', ...leafPieceInches(1.35, 0.675), count: 8 }])
    expect(light[0]!.heightIn).toBeLessThan(dark[0]!.heightIn)
  })

  it("takes a leaf piece as the bounding rectangle of its template's cut line, rounded up to 1/8 in", () => {
    // Across the open end: 3/4 in + 2 × 1/8 in cut allowance = 1 in (the widest the cut line gets).
    expect(leafPieceInches(1.5, 0.75).widthIn).toBe(1)
    const { cutPolygon } = leafTemplate(2, 1)
    const ys = cutPolygon.map((p) => p[1])
    const height = Math.max(...ys) - Math.min(...ys)
    const piece = leafPieceInches(2, 1)
    expect(piece.heightIn).toBeGreaterThanOrEqual(height)
    expect(piece.heightIn - height).toBeLessThan(0.125)
    expect((piece.heightIn * 8) % 1).toBe(0)
  })

  it('leaves out a leaf too wide for its length, as the board and the booklet do', () => {
    const x = xCrossing({ leaves: [{ id: 'l1', seam: 's1', at: 0.2, side: 'left', angle: 0, length: 0.5, width: 3, layers: ['dark'] }] })
    const pieces = cuttingPieces(x, planDesign(x), OPTIONS)
    expect(pieces.leaves).toEqual([])
    expect(pieces.fabrics.some((f) => f.fabric === 'dark')).toBe(false)
  })

  it('cuts a berry circle about twice its finished diameter plus 1/4 in, from its bounding square (from memory)', () => {
    // From memory (references.md: check in a sample, keep it a setting): 2 × 1/2 in + 1/4 in = 1 1/4 in.
    expect(BERRY_EXTRA_INCHES).toBe(0.25)
    expect(berryCutDiameterInches(0.5)).toBe(1.25)
    expect(berryCutDiameterInches(0.5, 0.5)).toBe(1.5)
    const x = xCrossing({ berries: [{ at: [1, 1], finishedDiameter: 0.5, fabric: 'berry' }, { at: [2, 1], finishedDiameter: 0.5, fabric: 'berry' }] })
    const pieces = cuttingPieces(x, planDesign(x), OPTIONS)
    expect(pieces.berries).toEqual([{ fabric: 'berry', count: 8, cutDiameterIn: 1.25 }])
    expect(pieces.fabrics.find((f) => f.fabric === 'berry')!.pieces).toEqual([{ for: 'berry', widthIn: 1.25, heightIn: 1.25, count: 8 }])
  })

  it('cuts the stem ring and the binding from squares of continuous bias', () => {
    const x = xCrossing({ stems: [{ radius: 7.75, finishedWidth: 0.375, fabric: 'stem' }] })
    const pieces = cuttingPieces(x, planDesign(x), OPTIONS)
    // 2π × 7.75 + 4 = 52.7 → 53 in, cut 2 × 3/8 + 1/2 = 1 1/4 in wide; its square from bias.ts.
    expect(pieces.stems).toEqual([{ fabric: 'stem', lengthIn: 53, cutWidthIn: 1.25, squareIn: 9.625, squares: 1 }])
    expect(pieces.fabrics.find((f) => f.fabric === 'stem')!.pieces).toEqual([{ for: 'stem', widthIn: 9.625, heightIn: 9.625, count: 1 }])
    // Binding: 2π × 9 + 10 = 66.5 → 67 in, 2 1/4 in wide, from the "binding" role.
    expect(pieces.binding).toEqual({ fabric: 'binding', lengthIn: 67, cutWidthIn: 2.25, squareIn: continuousBiasSquareInches(67, 2.25), squares: 1 })
  })

  it('binds both edges of a ring with a hole from one continuous strip', () => {
    const ring = design({ ring: { ...quarterWedge, innerRadius: 3, outerRadius: 10 } })
    // outer 2π × 10 + 10 = 72.8 → 73 in; inner 2π × 3 + 10 = 28.8 → 29 in; 102 in together.
    expect(cuttingPieces(ring, planDesign(ring), OPTIONS).binding.lengthIn).toBe(102)
  })
})

describe('biasSquares', () => {
  it('splits a strip into the fewest equal squares that fit the width of fabric', () => {
    const one = biasSquares(53, 1.25, 40)
    expect(one).toEqual({ sideIn: 9.625, count: 1 })
    // 2000 in of binding 2 1/4 in wide needs a square of about √4500 = 67 in: too wide for 40 in.
    const split = biasSquares(2000, 2.25, 40)
    expect(split.count).toBeGreaterThan(1)
    expect(split.sideIn).toBeLessThanOrEqual(40)
    expect(continuousBiasSquareInches(2000 / (split.count - 1), 2.25)).toBeGreaterThan(40)
  })
})
