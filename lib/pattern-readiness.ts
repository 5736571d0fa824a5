import { planDesign, type Design } from '@/geometry'

/**
 * What a pattern needs before testers sew it or buyers pay for it (issue 13): a sewing plan
 * without an error, and at least one colourway that gives every fabric role of the design a
 * fabric. Pure, so the service (which refuses a state change) and tests share it.
 */

/** One reason a pattern is not ready, in the words the refusal uses. */
export interface ReadinessProblem {
  readonly rule: 'sewable-plan' | 'complete-colorway'
  readonly message: string
}

/**
 * The fabric roles the design names: its areas' fills, its leaves' layers, stems, berries and the
 * binding, in first-seen order.
 *
 * @example rolesOfDesign({ fills: [{ at: [0, 0], fabric: 'cream' }], leaves: [], stems: [], berries: [], binding: { fabric: 'red' } } as never) // ['cream', 'red']
 */
export function rolesOfDesign(design: Pick<Design, 'fills' | 'leaves' | 'stems' | 'berries' | 'binding'>): string[] {
  const roles = new Set<string>()
  for (const fill of design.fills) roles.add(fill.fabric)
  for (const leaf of design.leaves) for (const layer of leaf.layers) roles.add(layer)
  for (const stem of design.stems) roles.add(stem.fabric)
  for (const berry of design.berries) roles.add(berry.fabric)
  if (design.binding?.fabric) roles.add(design.binding.fabric)
  return [...roles]
}

/**
 * Why the design is not ready for testing or sale, or an empty list when it is. The plan comes
 * from the geometry core, as everywhere else; only its errors count (warnings do not stop a
 * pattern). A colourway is complete when it gives each role of `rolesOfDesign` a fabric; one
 * complete colourway is enough, and when none is, the first colourway's gap is named.
 *
 * @example readinessProblems(design)[0]?.message // 'colourway Holly leaves role leaf-dark without a fabric'
 */
export function readinessProblems(design: Design): ReadinessProblem[] {
  const problems: ReadinessProblem[] = []
  const plan = planDesign(design, { suggestions: false })
  const error = plan.problems.find((problem) => problem.severity === 'error')
  if (error) problems.push({ rule: 'sewable-plan', message: `the sewing plan has an error: ${error.message}` })
  else if (!plan.sewable) problems.push({ rule: 'sewable-plan', message: 'the sewing plan has an error: the design has no section to sew yet' })
  const roles = rolesOfDesign(design)
  const gaps = design.colorways.map((colorway) => ({ colorway, missing: roles.filter((role) => !Object.hasOwn(colorway.fabrics, role)) }))
  if (gaps.length === 0) {
    problems.push({ rule: 'complete-colorway', message: 'the pattern needs a colourway that gives every fabric role a fabric' })
  } else if (!gaps.some((gap) => gap.missing.length === 0)) {
    const first = gaps[0]!
    problems.push({ rule: 'complete-colorway', message: `colourway ${first.colorway.name} leaves role ${first.missing[0]} without a fabric` })
  }
  return problems
}
