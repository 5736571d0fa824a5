'use client'

import Link from 'next/link'
import { useDeferredValue, useEffect, useMemo, useState } from 'react'
import { ReportThread } from '@/components/reports/report-thread'
import { apiFetch } from '@/lib/api-client'
import { boardPlan } from '@/lib/board/board-plan'
import { design as designOf, type BoardStore } from '@/lib/board/store'
import { toScreen } from '@/lib/board/view'
import { changedAtPin } from '@/lib/report-place'
import { placeInWords, REPORT_KIND_NAMES, reportListAnswerSchema, type ReportView } from '@/lib/schemas/report'
import { unitsPerInch } from '@/lib/units'
import { useBoard } from './use-board'

/**
 * The test reports on the drafting board: a toggle shows the open reports as pins at their places
 * (a point where it was clicked; an area at its label in the first repeat), drawn over the canvas
 * as buttons so they take clicks without reaching the drawing tools. A pin opens its thread (read,
 * answer, resolve). A pin whose area the design being edited has redrawn keeps its point and says
 * so, worked out from the board's own plan as it changes.
 */
export function ReportPins({ store, patternId }: { store: BoardStore; patternId: string }) {
  const [shown, setShown] = useState(false)
  const [reports, setReports] = useState<ReportView[] | null>(null)
  const [error, setError] = useState<string | null>(null)
  const [openId, setOpenId] = useState<string | null>(null)
  const design = useBoard(store, designOf)
  const view = useBoard(store, (state) => state.view)
  const plannedDesign = useDeferredValue(design)
  const plan = useMemo(() => boardPlan(plannedDesign), [plannedDesign])

  useEffect(() => {
    if (!shown) return
    let current = true
    apiFetch(`/api/patterns/${patternId}/reports?state=open&sort=oldest`, { schema: reportListAnswerSchema })
      .then((answer) => current && (setReports(answer.reports), setError(null)))
      .catch((caught: Error) => current && setError(caught.message))
    return () => {
      current = false
    }
  }, [shown, patternId])

  const factor = unitsPerInch(design.units)
  const ringInInches = { ...design.ring, innerRadius: design.ring.innerRadius / factor, outerRadius: design.ring.outerRadius / factor }
  const pinned = (reports ?? []).filter((report) => report.state === 'open' && report.pin)
  const open = reports?.find((report) => report.id === openId) ?? null
  const changedNow = (report: ReportView) => (plan.plan ? changedAtPin(report.pin, plan.plan, ringInInches) : report.changedSince)

  return (
    <>
      <div className="absolute right-2 top-2 z-10 flex items-center gap-2">
        <button
          type="button"
          aria-pressed={shown}
          onClick={() => setShown((value) => !value)}
          className="rounded border border-stone-300 bg-white/90 px-2 py-1 text-xs shadow-sm hover:bg-linen-100"
        >
          {shown ? `Hide test reports${reports ? ` (${pinned.length})` : ''}` : 'Show test reports'}
        </button>
        {shown && (
          <Link href={`/patterns/${patternId}/reports`} className="rounded bg-white/90 px-2 py-1 text-xs text-thread-700 underline">
            All reports
          </Link>
        )}
        {error && (
          <span role="alert" className="rounded bg-white/90 px-2 py-1 text-xs text-madder-700">
            {error}
          </span>
        )}
      </div>
      {shown &&
        pinned.map((report, index) => {
          const [x, y] = toScreen([report.pin!.point[0] * factor, report.pin!.point[1] * factor], view, design.ring.repeats)
          const changed = changedNow(report)
          return (
            <button
              key={report.id}
              type="button"
              data-testid="report-pin"
              aria-label={`Report ${index + 1}: ${REPORT_KIND_NAMES[report.kind]} at ${placeInWords(report.place)}${changed ? ', the design has changed here since' : ''}`}
              onClick={() => setOpenId(report.id)}
              style={{ left: x, top: y }}
              className={`absolute z-10 flex h-6 w-6 -translate-x-1/2 -translate-y-full items-center justify-center rounded-full rounded-bl-none border-2 border-white text-xs font-bold text-white shadow ${changed ? 'bg-amber-600' : 'bg-madder-600'}`}
            >
              {index + 1}
            </button>
          )
        })}
      {shown && open && (
        <aside aria-label="Test report" className="absolute bottom-2 right-2 top-12 z-20 w-80 max-w-[90%] overflow-auto rounded-lg border border-linen-200 bg-white p-3 shadow-lg">
          <div className="mb-2 flex justify-end">
            <button type="button" onClick={() => setOpenId(null)} className="text-xs text-thread-700 underline">
              Close
            </button>
          </div>
          <ReportThread
            report={{ ...open, changedSince: changedNow(open) }}
            canChangeState
            onChange={(changed) => setReports((list) => (list ?? []).map((report) => (report.id === changed.id ? changed : report)))}
          />
        </aside>
      )}
    </>
  )
}
