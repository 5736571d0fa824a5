'use client'

import type { Plan } from '@/geometry'
import type { BoardDesign } from '@/lib/board/commands'
import { repairPreview } from '@/lib/board/repair-ghost'
import { design as designOf, type BoardStore } from '@/lib/board/store'
import { formatLength } from '@/lib/units'
import { useBoard } from './use-board'
import { useRepairSuggestions } from './use-repair-suggestions'

const sectionsInWords = (count: number) => `${count} section${count === 1 ? '' : 's'}`

/**
 * The repairs the plan suggests, beside its problems: for a design that cannot be sewn, small
 * changes of its seams, a resized leaf or the order Wreathwright chooses instead of a wrong
 * hand-set one, that make it sewable; for one that sews in several sections, changes that save
 * a section. Pointing at one (or tabbing to it) draws it as a ghost on the ring;
 * choosing it applies it as one undoable step. Only the designer applies a suggestion.
 */
export function RepairSuggestions({ store, design, plan }: { store: BoardStore; design: BoardDesign; plan: Plan }) {
  const found = useRepairSuggestions(store, design)
  const shown = useBoard(store, (state) => state.shownRepair)
  if (found === null) return null
  const heading = plan.sewable ? 'Could sew in fewer sections' : 'Changes that would make it sewable'
  // A design sewable as it is needs no "nothing found": only an unsewable one says so.
  if (plan.sewable && (found === 'looking' || found.suggestions.length === 0)) return null

  return (
    <div className="space-y-1" data-testid="repair-suggestions" data-state={found === 'looking' ? 'looking' : 'ready'}>
      <h3 className="text-xs font-semibold text-stone-600">{heading}</h3>
      {found === 'looking' ? (
        <p className="text-xs text-stone-500" aria-live="polite">Looking for small changes that would help…</p>
      ) : found.suggestions.length === 0 ? (
        <p className="text-xs text-stone-500" aria-live="polite">No small change of the seams was found: redraw around the problem by hand.</p>
      ) : (
        <ul className="space-y-1 text-xs">
          {found.suggestions.map(({ suggestion, seams, leaves }, index) => {
            const preview = () => store.showRepair(repairPreview(design, seams, index, leaves))
            const hide = () => store.showRepair(null)
            const details = [
              `sews in ${sectionsInWords(suggestion.sections)}`,
              suggestion.addedLengthIn > 0 ? `adds ${formatLength(suggestion.addedLengthIn, design.units)} of seam` : null,
              suggestion.movedIn > 0 ? `moves seam ends ${formatLength(suggestion.movedIn, design.units)}` : null,
              suggestion.clearsOrder ? 'replaces your hand-set order' : null,
            ].filter(Boolean)
            return (
              <li key={index}>
                <button
                  type="button"
                  data-testid="repair-suggestion"
                  data-shown={shown?.base === design && shown.index === index}
                  className="w-full rounded border border-thread-700/30 bg-white px-2 py-1 text-left hover:bg-linen-100 focus:bg-linen-100"
                  title="Apply this change (Ctrl+Z undoes it)"
                  onMouseEnter={preview}
                  onFocus={preview}
                  onMouseLeave={hide}
                  onBlur={hide}
                  onClick={() => {
                    // The list belongs to the design planned; a change made since then would be lost.
                    if (designOf(store.getState()) !== design) return
                    store.run('applyRepair', { seams: suggestion.seams, leaves: suggestion.leaves, clearsOrder: suggestion.clearsOrder })
                  }}
                >
                  <span className="block text-stone-800">{suggestion.message}</span>
                  <span className="block text-stone-500">{details.join(' · ')}</span>
                </button>
              </li>
            )
          })}
        </ul>
      )}
      {found !== 'looking' && found.stopped && (
        <p className="text-xs text-stone-500" data-testid="repair-search-stopped">
          The search stopped at its time limit: a better change may exist.
        </p>
      )}
    </div>
  )
}
