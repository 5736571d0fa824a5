'use client'

import { useDeferredValue, useMemo } from 'react'
import { boardPlan } from '@/lib/board/board-plan'
import { formatSize } from '@/lib/units'
import { design as designOf, type BoardStore } from '@/lib/board/store'
import { fabricDisplayName, sectionLetter, type JoinTree } from '@/geometry'
import { RepairSuggestions } from './repair-suggestions'
import { useBoard } from './use-board'

const small = 'rounded border border-stone-300 bg-white px-2 py-1 text-xs hover:bg-linen-100 disabled:opacity-40'

function describeJoins(tree: JoinTree | readonly []): string {
  if (typeof tree === 'string') return tree
  if (tree.length === 0) return ''
  const [left, right] = tree as readonly [JoinTree, JoinTree]
  return `(${describeJoins(left)} + ${describeJoins(right)})`
}

/**
 * The sewing plan beside the board: whether it can be sewn, the problems in plain words, the
 * changes suggested to mend them (or to save a section), every step with its rough-cut piece and
 * the leaves to baste first, a step-through, and the controls for setting the order by hand.
 */
export function PlanPanel({ store }: { store: BoardStore }) {
  const design = useBoard(store, designOf)
  const step = useBoard(store, (state) => state.step)
  const tool = useBoard(store, (state) => state.tool)
  const handOrder = useBoard(store, (state) => state.handOrderDraft)
  const plannedDesign = useDeferredValue(design)
  const result = useMemo(() => boardPlan(plannedDesign), [plannedDesign])
  const plan = result.plan
  const steps = result.steps
  const current = step !== null && steps.length > 0 ? steps[Math.min(step, steps.length - 1)] : undefined
  const errors = plan?.problems.filter((p) => p.severity === 'error') ?? []
  const warnings = plan?.problems.filter((p) => p.severity === 'warning') ?? []
  const units = design.units
  const activeColorway = useBoard(store, (state) => state.activeColorway)
  const colorway = design.colorways.find((c) => c.name === activeColorway) ?? design.colorways[0]
  /** A fabric role by the name the shown colourway gives it (never the role's key). */
  const nameOf = (fabric: string) => fabricDisplayName(colorway, fabric)

  /** A leaf with its stacked fabrics, bottom first, as the maker reads it while sewing. */
  function describeLeaf(leafId: string): string {
    const leaf = design.leaves.find((l) => l.id === leafId)
    const name = result.leafNames.get(leafId) ?? 'a leaf'
    return leaf ? `${name} (${leaf.layers.map(nameOf).join(' under ')})` : name
  }

  function checkHandOrder() {
    const sections = (handOrder ?? []).filter((section) => section.length > 0)
    if (sections.length === 0) return
    store.run('setHandOrder', {
      sections: sections.map((areas, index) => ({ label: sectionLetter(index), areas: areas.map((p) => [p[0], p[1]] as [number, number]) })),
      assembly: null,
    })
    store.endHandOrder()
  }

  return (
    <section aria-labelledby="plan-heading" className="space-y-3" data-testid="plan-panel">
      <h2 id="plan-heading" className="text-sm font-semibold uppercase tracking-wide text-stone-500">
        Sewing plan
      </h2>
      {result.issues.length > 0 && (
        <ul role="alert" className="space-y-1 text-xs text-madder-700">
          {result.issues.map((issue) => (
            <li key={issue.path}>
              {issue.path}: {issue.message}
            </li>
          ))}
        </ul>
      )}
      {plan && (
        <p data-testid="plan-status" data-sewable={plan.sewable} className={`rounded px-2 py-1 text-sm ${plan.sewable ? 'bg-thread-700/10 text-thread-800' : 'bg-madder-600/10 text-madder-700'}`}>
          {plan.sewable
            ? `Sewable: ${plan.areas.length} areas in ${plan.sections.length} section${plan.sections.length === 1 ? '' : 's'}${design.order ? ' (your order)' : ''}.`
            : 'Cannot be sewn as drawn — see below.'}
        </p>
      )}
      {(errors.length > 0 || warnings.length > 0) && (
        <ul className="space-y-1 text-xs" data-testid="problems">
          {[...plan!.problems.entries()]
            .sort(([, a], [, b]) => (a.severity === b.severity ? 0 : a.severity === 'error' ? -1 : 1))
            .map(([index, problem]) => {
            const error = problem.severity === 'error'
            return (
              <li key={index} data-severity={problem.severity}>
                <button
                  type="button"
                  onClick={() => store.showProblem(index)}
                  onFocus={() => store.showProblem(index)}
                  className={`w-full rounded border-l-4 bg-white px-2 py-1 text-left ${error ? 'border-madder-600' : 'border-amber-500'}`}
                  title="Show it on the board"
                >
                  <strong className={error ? 'text-madder-700' : 'text-amber-700'}>{error ? 'Problem: ' : 'Note: '}</strong>
                  {problem.message}
                </button>
              </li>
            )
            })}
        </ul>
      )}
      {plan && <RepairSuggestions store={store} design={plannedDesign} plan={plan} />}
      {plan && plan.ringAssembly.message && <p className="text-xs text-stone-600">Repeats: {plan.ringAssembly.message}</p>}
      {plan && plan.sections.length > 1 && <p className="text-xs text-stone-600">Join the sections: {describeJoins(plan.assembly)}</p>}

      {steps.length > 0 && (
        <div className="space-y-2 rounded border border-linen-200 bg-white p-2">
          <div className="flex items-center gap-1">
            <button type="button" className={small} disabled={!current || step === 0} onClick={() => store.previousStep()}>
              ‹ Previous
            </button>
            <button type="button" className={small} disabled={step !== null && step >= steps.length - 1} onClick={() => store.nextStep()}>
              {step === null ? 'Step through' : 'Next ›'}
            </button>
            {step !== null && (
              <button type="button" className={small} onClick={() => store.showStep(null)}>
                Done
              </button>
            )}
          </div>
          {current && (
            <p className="text-xs" data-testid="current-step" aria-live="polite">
              <strong>Step {(step ?? 0) + 1} of {steps.length}: {current.label}</strong> — {current.fabric ? nameOf(current.fabric) : 'no fabric yet'}.{' '}
              {current.planned.leavesBefore.length > 0 && <>First baste {current.planned.leavesBefore.map(describeLeaf).join('; ')} in place. </>}
              {current.sewnAlong ? 'Lay the piece right side down over the sewn areas, sew on the marked line, flip and press.' : 'Place the piece wrong side to the unprinted side of the paper.'}{' '}
              Cut {formatSize(current.planned.roughCut.widthIn, current.planned.roughCut.heightIn, units)}.
            </p>
          )}
        </div>
      )}

      {plan && plan.sections.length > 0 && (
        <ol className="max-h-64 space-y-2 overflow-auto text-xs" aria-label="Steps by section">
          {plan.sections.map((section) => (
            <li key={section.label}>
              <strong>Section {section.label}</strong>
              <ol className="ml-3 list-decimal">
                {section.order.map((id) => {
                  const area = result.areas.find((a) => a.id === id)!
                  return (
                    <li key={id} className="ml-2">
                      {area.label} · {area.fabric ? nameOf(area.fabric) : '—'} · cut {formatSize(area.planned.roughCut.widthIn, area.planned.roughCut.heightIn, units)}
                      {area.planned.leavesBefore.length > 0 && <> · baste {area.planned.leavesBefore.map((id) => result.leafNames.get(id) ?? 'a leaf').join(', ')} first</>}
                    </li>
                  )
                })}
              </ol>
            </li>
          ))}
        </ol>
      )}

      <div className="space-y-1 border-t border-linen-200 pt-2">
        <h3 className="text-xs font-semibold text-stone-600">Order by hand</h3>
        {tool === 'order' ? (
          <>
            <p className="text-xs text-stone-600">Click the areas in the order you would sew them. Start a new section when a paper is full.</p>
            <div className="flex flex-wrap gap-1">
              <button type="button" className={small} onClick={() => store.newHandOrderSection()}>
                Start the next section
              </button>
              <button type="button" className={small} onClick={checkHandOrder}>
                Check this order
              </button>
              <button type="button" className={small} onClick={() => store.restartHandOrder()}>
                Start again
              </button>
            </div>
          </>
        ) : design.order ? (
          <button type="button" className={small} onClick={() => store.run('setHandOrder', null)}>
            Go back to the proposed order
          </button>
        ) : (
          <button type="button" className={small} onClick={() => store.chooseTool('order')}>
            Set the order by hand
          </button>
        )}
      </div>
    </section>
  )
}
