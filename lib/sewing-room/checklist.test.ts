import { describe, expect, it } from 'vitest'
import { applyTransform, leafLayers, repeatTransforms } from '@/geometry'
import { asymmetricFile, designFrom, medallionFile } from '@/lib/booklet/test-support/designs'
import type { PictureOverlay, SvgMatrix } from '@/lib/schemas/sewing-room'
import { hollyberryWreath } from '@/scripts/demo-wreath'
import { checklistOfModel, sewingChecklist, sewingModel, STEP_CAUTIONS } from './checklist'
import { sectionJoins } from './joins'
import { sewingPicture } from './picture'

const wreath = designFrom(hollyberryWreath)
const options = { colorway: 0, diameterIn: 18 }

describe('the sewing checklist of the demo wreath', () => {
  const model = sewingModel(wreath, options)
  const checklist = checklistOfModel(model)
  const { steps, groups } = checklist
  const repeats = wreath.ring.repeats

  it('groups the work in the order it happens', () => {
    expect(groups.map((group) => group.id)).toEqual(['prepare-leaves', 'cut', 'repeat-1', 'repeat-2', 'repeat-3', 'repeat-4', 'join-sections', 'join-repeats', 'finishing'])
    // Every step belongs to a listed group, and the steps come group by group in that order.
    const order = steps.map((step) => groups.findIndex((group) => group.id === step.group))
    expect(order.every((index) => index >= 0)).toBe(true)
    expect([...order].sort((a, b) => a - b)).toEqual(order)
  })

  it('folds, per fabric, every layer of every leaf once per repeat', () => {
    const expected = new Map<string, number>()
    for (const leaf of wreath.leaves) for (const layer of leafLayers(leaf)) expected.set(layer.fabric, (expected.get(layer.fabric) ?? 0) + repeats)
    const leafSteps = steps.filter((step) => step.group === 'prepare-leaves')
    expect(leafSteps.map((step) => step.id)).toEqual([...expected.keys()].map((fabric) => `leaves:${fabric}`))
    for (const step of leafSteps) {
      const fabric = step.id.slice('leaves:'.length)
      // 4 leaves of 2 layers, one layer of each green: 4 leaves × 4 repeats = 16 of each.
      expect(step.label).toMatch(new RegExp(`^Fold ${expected.get(fabric)} leaves from `))
    }
    expect(leafSteps[0]!.label).toBe('Fold 16 leaves from Holly green batik')
    expect(leafSteps[0]!.instruction).toContain(STEP_CAUTIONS.inserts)
  })

  it('cuts every fabric the colourway needs, from the cutting layout', () => {
    const cutSteps = steps.filter((step) => step.group === 'cut')
    expect(cutSteps.map((step) => step.id)).toContain('cut:background')
    expect(cutSteps.map((step) => step.id)).toContain('cut:binding')
    expect(cutSteps[0]!.instruction).toMatch(/^Strip 1, /)
  })

  it('lists every plan area in exactly one step of each repeat, in sewing order', () => {
    for (let repeat = 1; repeat <= repeats; repeat += 1) {
      const sewn = steps.filter((step) => step.repeat === repeat).flatMap((step) => step.areas)
      expect([...sewn].sort()).toEqual(model.plan.areas.map((area) => area.id).sort())
      expect(new Set(sewn).size).toBe(sewn.length)
      const labels = steps.filter((step) => step.group === `repeat-${repeat}` && step.id.includes(':area:')).map((step) => step.id.split(':')[2])
      expect(labels).toEqual(model.plan.sections.flatMap((section) => section.order.map((id) => model.plan.areas.find((area) => area.id === id)!.label)))
    }
  })

  it('says what to sew and which leaves to baste before it, with the rough cut', () => {
    const a2 = steps.find((step) => step.id === 'r3:area:A2')!
    expect(a2.label).toBe('Sew area A2 along its seam with A1')
    expect(a2.repeat).toBe(3)
    expect(a2.leaves).toEqual(['leaf 1 of A1'])
    expect(a2.instruction).toContain('Baste leaf 1 of A1')
    const area = model.plan.areas.find((candidate) => candidate.label === 'A2')!
    expect(a2.roughCut).toEqual({ widthIn: area.roughCut.widthIn, heightIn: area.roughCut.heightIn })
    expect(steps.find((step) => step.id === 'r1:area:A1')!.label).toMatch(/^Place .* on area A1$/)
    expect(steps.find((step) => step.id === 'r2:trim:B')).toMatchObject({ group: 'repeat-2', repeat: 2, areas: [] })
  })

  it('joins the sections in each repeat as the join tree says, then the repeats in halves', () => {
    expect(steps.filter((step) => step.group === 'join-sections').map((step) => step.id)).toEqual(['join:r1:A+B', 'join:r2:A+B', 'join:r3:A+B', 'join:r4:A+B'])
    // Four wedges: two halves of two (one join each), then the halves: 3 joins.
    expect(steps.filter((step) => step.group === 'join-repeats').map((step) => step.id)).toEqual(['ring:join:1', 'ring:join:2', 'ring:join:3'])
  })

  it('finishes with only what the design has', () => {
    expect(steps.filter((step) => step.group === 'finishing').map((step) => step.id)).toEqual([
      'finish:papers', 'finish:stem:1', 'finish:curls', 'finish:quilting', 'finish:berries', 'finish:binding',
    ])
    expect(steps.find((step) => step.id === 'finish:berries')!.instruction).toContain(STEP_CAUTIONS.berries)
    const plain = checklistOfModel(sewingModel(designFrom(asymmetricFile()), options)).steps.filter((step) => step.group === 'finishing')
    expect(plain.map((step) => step.id)).toEqual(['finish:papers', 'finish:quilting', 'finish:binding'])
  })

  it('gives every step a unique id, the same on every call and at any size', () => {
    const ids = steps.map((step) => step.id)
    expect(new Set(ids).size).toBe(ids.length)
    expect(sewingChecklist(wreath, options)).toEqual(checklist)
    // Labels do not change with the size, so neither do the ids.
    expect(sewingChecklist(wreath, { colorway: 1, diameterIn: 30 }).steps.map((step) => step.id)).toEqual(ids)
  })

  it('names fabrics in the chosen colourway', () => {
    const other = sewingChecklist(wreath, { colorway: 1, diameterIn: 18 })
    const name = wreath.colorways[1]!.fabrics['leaf-dark']!.name
    expect(other.steps[0]!.label).toBe(`Fold 16 leaves from ${name}`)
  })
})

describe('the checklist of other rings', () => {
  it('marks the mirrored repeats and closes a ring with a hole', () => {
    const checklist = sewingChecklist(designFrom(medallionFile()), { colorway: 0, diameterIn: 20 })
    expect(checklist.groups.find((group) => group.id === 'repeat-2')!.label).toBe('Repeat 2 (mirror image)')
    expect(checklist.groups.find((group) => group.id === 'repeat-1')!.label).toBe('Repeat 1')
    const ring = checklist.steps.filter((step) => step.group === 'join-repeats')
    // Six repeats in a chain: five joins, then the last radial seam closes the ring.
    expect(ring).toHaveLength(6)
    expect(ring[5]!.label).toBe('Close the ring: join repeat 6 to repeat 1')
    expect(checklist.groups.map((group) => group.id)).not.toContain('prepare-leaves')
  })

  it('lists a tree of joins pairs first', () => {
    expect(sectionJoins([['A', 'B'], ['C', 'D']]).map((join) => `${join.first}+${join.second}`)).toEqual(['A+B', 'C+D', 'AB+CD'])
    expect(sectionJoins('A')).toEqual([])
    expect(sectionJoins([])).toEqual([])
  })
})

/** SVG's matrix(a b c d e f) takes (x, y) to (a x + c y + e, b x + d y + f): SVG 1.1, section 7.4 "The 'transform' attribute". */
const applySvgMatrix = ([a, b, c, d, e, f]: SvgMatrix, [x, y]: readonly [number, number]): [number, number] => [a * x + c * y + e, b * x + d * y + f]

describe('the picture of a project', () => {
  const model = sewingModel(wreath, options)
  const picture = sewingPicture(model)
  const { steps } = checklistOfModel(model)
  const placed = (repeat: number) => picture.areas.flatMap((area) => area.points.map((point) => applySvgMatrix(picture.repeats[repeat - 1]!.matrix, point)))

  it('gives one repeat’s areas once, with each repeat’s place, in the screen frame round the centre', () => {
    expect(picture.viewBox).toEqual([-9, -9, 18, 18])
    expect(picture.areas).toHaveLength(model.plan.areas.length)
    expect(picture.repeats.map((place) => place.repeat)).toEqual([1, 2, 3, 4])
    // Repeat 1 is repeat 0 as drawn, y flipped: its areas lie in the upper right quarter of the screen.
    expect(picture.repeats[0]!.matrix).toEqual([1, 0, 0, 1, 0, 0])
    expect(placed(1).every(([x, y]) => x >= -1e-3 && y <= 1e-3)).toBe(true)
    // Repeat 2 is turned a quarter counter-clockwise as the quilt is seen: the upper left.
    expect(placed(2).every(([x, y]) => x <= 1e-3 && y <= 1e-3)).toBe(true)
    expect(placed(3).every(([x, y]) => x <= 1e-3 && y >= -1e-3)).toBe(true)
    expect(picture.areas.every((area) => /^#[0-9a-f]{6}$/.test(area.fill))).toBe(true)
  })

  it('places each repeat as the ring’s own transforms do, flipped to the screen', () => {
    const transforms = repeatTransforms(wreath.ring)
    picture.repeats.forEach(({ matrix }, index) => {
      for (const area of model.plan.areas) {
        const shown = picture.areas.find((candidate) => candidate.id === area.id)!
        area.polygon.forEach((point, corner) => {
          const [x, y] = applyTransform(transforms[index]!, point)
          const [sx, sy] = applySvgMatrix(matrix, shown.points[corner]!)
          expect(Math.abs(sx - x)).toBeLessThan(2e-3)
          expect(Math.abs(sy + y)).toBeLessThan(2e-3)
        })
      }
    })
  })

  it('draws a mirrored repeat as a mirror image', () => {
    const medallion = sewingPicture(sewingModel(designFrom(medallionFile()), { colorway: 0, diameterIn: 20 }))
    const determinant = ([a, b, c, d]: SvgMatrix) => a * d - b * c
    expect(medallion.repeats.map(({ matrix }) => Math.round(determinant(matrix)))).toEqual([1, -1, 1, -1, 1, -1])
  })

  it('ties everything laid over the areas to a step of the checklist, repeat by repeat', () => {
    const ids = new Set(steps.map((step) => step.id))
    const stepIdsOf = (overlay: PictureOverlay) => ('stepId' in overlay ? [overlay.stepId] : overlay.stepIds.filter((id) => id !== null))
    expect(picture.overlays.flatMap(stepIdsOf).every((id) => ids.has(id))).toBe(true)
    // Each leaf's layers appear with the step that catches them, in every repeat.
    const repeated = picture.overlays.filter((overlay) => 'stepIds' in overlay)
    expect(repeated.filter((overlay) => overlay.stepIds[1] === 'r2:area:A2')).toHaveLength(2)
    expect(repeated.every((overlay) => overlay.stepIds.length === wreath.ring.repeats)).toBe(true)
    expect(repeated.filter((overlay) => overlay.stepIds[0] === 'finish:berries')).toHaveLength(wreath.berries.length)
    expect(picture.overlays.filter((overlay) => 'stepId' in overlay && overlay.stepId === 'finish:binding')).toHaveLength(1)
  })
})
