import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { designFrom, medallionFile } from '@/lib/booklet/test-support/designs'
import type { PlanAnswer, ProjectDetail, ProjectStep } from '@/lib/schemas/sewing-room'
import { hollyberryWreath } from '@/scripts/demo-wreath'
import { checklistOfModel, sewingModel } from './checklist'
import { sewingPicture } from './picture'
import { planAnswer, readPlan } from './plan-answer'
import { projectSummary } from './test-support/project'

/** A plan as the server makes it, with some steps' progress stored. */
function detailOf(design: Parameters<typeof sewingModel>[0], options: { colorway: number; diameterIn: number }): ProjectDetail {
  const model = sewingModel(design, options)
  const { groups, steps } = checklistOfModel(model)
  const withProgress = steps.map((step, index): ProjectStep => {
    if (index % 5 === 1) return { ...step, done: true, note: null, updatedAt: '2026-12-03T10:00:00.000Z' }
    if (index % 7 === 3) return { ...step, done: false, note: 'ran out of the light green', updatedAt: '2026-12-03T10:05:00.000Z' }
    return { ...step, done: false, note: null, updatedAt: null }
  })
  return {
    project: projectSummary({
      diameterIn: options.diameterIn,
      done: withProgress.filter((step) => step.done).length,
      total: withProgress.length,
      updatedAt: '2026-12-03T10:05:00.000Z',
    }),
    groups: groups.map((group) => ({ ...group, done: 0, total: 0 })),
    steps: withProgress,
    nextStepId: withProgress.find((step) => !step.done)?.id ?? null,
    picture: sewingPicture(model),
  }
}

describe('a sewing plan as sent', () => {
  const wreath = detailOf(designFrom(hollyberryWreath), { colorway: 0, diameterIn: 18 })

  it('reads back exactly the plan it was written from', () => {
    expect(readPlan(planAnswer(wreath))).toEqual(wreath)
    const medallion = detailOf(designFrom(medallionFile()), { colorway: 0, diameterIn: 20 })
    expect(readPlan(planAnswer(medallion))).toEqual(medallion)
  })

  it('survives the trip through JSON, as the page receives it', () => {
    expect(readPlan(JSON.parse(JSON.stringify(planAnswer(wreath))) as PlanAnswer)).toEqual(wreath)
  })

  it('writes each instruction once, and untouched progress not at all', () => {
    const answer = planAnswer(wreath)
    expect(new Set(answer.words).size).toBe(answer.words.length)
    expect(answer.words.length).toBe(new Set(wreath.steps.flatMap((step) => (step.instruction === undefined ? [] : [step.instruction]))).size)
    // The wreath's four repeats say the same things: fewer than half as many instructions as steps.
    expect(answer.words.length * 2).toBeLessThan(answer.steps.length)
    const untouched = answer.steps.filter((_, index) => index % 5 !== 1 && index % 7 !== 3)
    expect(untouched.every((step) => !('done' in step) && !('note' in step) && !('updatedAt' in step))).toBe(true)
    // The steps are written in under three fifths of what they take written out in full.
    expect(JSON.stringify({ words: answer.words, steps: answer.steps }).length).toBeLessThan(0.6 * JSON.stringify(wreath.steps).length)
  })

  it('reads back any steps it was written from', () => {
    const words = fc.constantFrom('Sew it.', 'Press it.', 'Trim it 1/4 in past the line.', 'Sew it. ')
    const stepArbitrary = fc.record({
      id: fc.string({ minLength: 1, maxLength: 12 }),
      group: fc.constantFrom('cut', 'repeat-1', 'finishing'),
      label: fc.string({ maxLength: 20 }),
      instruction: fc.option(words, { nil: undefined }),
      repeat: fc.option(fc.integer({ min: 1, max: 12 }), { nil: null }),
      areas: fc.array(fc.string({ maxLength: 4 }), { maxLength: 3 }),
      done: fc.boolean(),
      note: fc.option(fc.string({ maxLength: 10 }), { nil: null }),
      updatedAt: fc.option(fc.constant('2026-12-03T10:00:00.000Z'), { nil: null }),
    })
    fc.assert(
      fc.property(fc.array(stepArbitrary, { maxLength: 30 }), (drawn) => {
        const steps = drawn.map(({ instruction, ...step }): ProjectStep => (instruction === undefined ? step : { ...step, instruction }))
        const detail: ProjectDetail = { ...wreath, steps }
        expect(readPlan(planAnswer(detail))).toEqual(detail)
      }),
    )
  })

  it('refuses an answer whose step names an instruction it does not carry', () => {
    const answer = planAnswer(wreath)
    const broken: PlanAnswer = { ...answer, steps: answer.steps.map((step, index) => (index === 0 ? { ...step, instruction: answer.words.length } : step)) }
    expect(() => readPlan(broken)).toThrow(/names instruction/)
  })
})
