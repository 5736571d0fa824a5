/**
 * A sewing plan as `GET /api/sewing-room/projects/:id` sends it, and back. The steps of a ring's
 * repeats carry the same instructions (the demo wreath's 76 steps say 33 different things, and a
 * ring of twelve would say each twelve times), so each distinct instruction is written once, in
 * `words`, and a step names its own by place; a step's progress is left out while it is the
 * starting one (not done, no note). The server writes it (planAnswer), the page reads it
 * (readPlan), and reading gives back exactly what was written.
 */
import type { PlanAnswer, PlanAnswerStep, ProjectDetail, ProjectStep } from '@/lib/schemas/sewing-room'

/** A step's progress while nothing has been stored for it. */
const UNTOUCHED = { done: false, note: null, updatedAt: null } as const

/**
 * The answer for a plan: its instructions each once, in the order first used.
 *
 * @example planAnswer(detail).words.length <= detail.steps.length // true
 */
export function planAnswer(detail: ProjectDetail): PlanAnswer {
  const places = new Map<string, number>()
  const words: string[] = []
  const steps = detail.steps.map((step): PlanAnswerStep => {
    const { instruction, done, note, updatedAt, ...rest } = step
    let place: number | undefined
    if (instruction !== undefined) {
      place = places.get(instruction)
      if (place === undefined) {
        place = words.push(instruction) - 1
        places.set(instruction, place)
      }
    }
    const untouched = !done && note === null && updatedAt === null
    return { ...rest, ...(place !== undefined && { instruction: place }), ...(!untouched && { done, note, updatedAt }) }
  })
  return { ...detail, words, steps }
}

/**
 * The plan an answer carries, every step with its instruction and progress. An instruction place
 * outside `words` is a server fault, not something to show: it throws.
 *
 * @example readPlan(planAnswer(detail)) // deep-equals detail
 */
export function readPlan(answer: PlanAnswer): ProjectDetail {
  const { words, steps, ...rest } = answer
  return {
    ...rest,
    steps: steps.map((step): ProjectStep => {
      const { instruction, ...fields } = step
      if (instruction !== undefined && (!Number.isInteger(instruction) || instruction < 0 || instruction >= words.length)) {
        throw new Error(`The plan's step ${step.id} names instruction ${instruction}, but the plan has ${words.length}.`)
      }
      return { ...UNTOUCHED, ...fields, ...(instruction !== undefined && { instruction: words[instruction]! }) }
    }),
  }
}
