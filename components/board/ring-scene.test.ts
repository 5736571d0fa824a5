import { describe, expect, it } from 'vitest'
import { mapSmoothCurve, smoothCurve, tryPlaceLeafLayers, type Point } from '@/geometry'
import { boardPlan } from '@/lib/board/board-plan'
import { normalizeDesign } from '@/lib/board/commands'
import { emptyDesign } from '@/lib/new-design'
import { ringScene, traceSmoothCurve } from './ring-scene'

/** A quarter ring with a seam, a leaf of two layers and a curl of three points. */
function design() {
  return normalizeDesign({
    ...emptyDesign('Scene'),
    ring: { innerRadius: 0, outerRadius: 9, repeats: 4, repeatMode: 'rotate' },
    seams: [{ id: 's1', from: [4, 0], to: [0, 4] }],
    leaves: [{ id: 'l1', seam: 's1', at: 0.5, side: 'left', angle: 0, length: 1.5, width: 0.75, layers: ['dark', 'light'], layerOffsets: [{}, { turn: -20, scale: 0.7 }] }],
    curls: [{ points: [[6, 1], [6.5, 1.6], [6.2, 2.1]] }],
  })
}

describe('the ring scene on the board', () => {
  it('draws every stacked layer where the booklet prints it, with its own turn and size', () => {
    const board = design()
    const scene = ringScene(board, boardPlan(board), { dark: '#2f5540', light: '#6f9a6a' })
    const placed = tryPlaceLeafLayers({ ...board.leaves[0]!, angle: 0 }, board.seams[0]!)
    if (!placed.ok) throw new Error(placed.reason)
    const repeat0 = scene.repeats[0]!
    expect(repeat0.leaves.map((leaf) => leaf.colour)).toEqual(['#2f5540', '#6f9a6a'])
    expect(repeat0.leaves.map((leaf) => leaf.points)).toEqual(placed.layers.map((layer) => layer.placement.finishedOutline))
  })

  it('draws each curl as geometry\'s smooth curve, moved to each repeat by its control points', () => {
    const board = design()
    const scene = ringScene(board, boardPlan(board), {})
    const curve = smoothCurve(board.curls[0]!.points)
    expect(scene.repeats[0]!.curls[0]).toEqual(curve)
    // Repeat 1 of 4 is repeat 0 turned a quarter turn: (x, y) → (−y, x).
    const turned = mapSmoothCurve(curve, ([x, y]: Point): Point => [-y, x])
    scene.repeats[1]!.curls[0]!.pieces.flat().forEach((p, i) => {
      expect(p[0]).toBeCloseTo(turned.pieces.flat()[i]![0], 12)
      expect(p[1]).toBeCloseTo(turned.pieces.flat()[i]![1], 12)
    })
    // On the canvas: one move to the start, then one Bézier per piece.
    const calls: string[] = []
    traceSmoothCurve({ moveTo: () => calls.push('moveTo'), bezierCurveTo: () => calls.push('bezierCurveTo') }, curve)
    expect(calls).toEqual(['moveTo', 'bezierCurveTo', 'bezierCurveTo'])
  })
})
