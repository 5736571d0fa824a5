'use client'

import Link from 'next/link'
import { useCallback, useEffect, useMemo, useState } from 'react'
import { apiFetch } from '@/lib/api-client'
import {
  placeInWords,
  REPORT_KIND_NAMES,
  REPORT_KINDS,
  REPORT_SEVERITY_NAMES,
  reportListAnswerSchema,
  type ReportKind,
  type ReportMap,
  type ReportState,
  type ReportView,
} from '@/lib/schemas/report'
import { ReportForm } from './report-form'
import { ReportThread } from './report-thread'

const control = 'rounded border border-stone-300 bg-white px-2 py-1 text-sm'

/**
 * A pattern's test reports. The designer (or an admin) sees them all in a table, filtered by
 * state, kind and tester and sorted by date, and opens each one's thread to answer, resolve or
 * reopen; a tester sees the pattern's reports the same way and files new ones.
 */
export function ReportsPage({
  patternId,
  patternName,
  areas,
  map,
  canFile,
  canChangeState,
  initialReportId,
}: {
  patternId: string
  patternName: string
  areas: readonly string[]
  map: ReportMap | null
  canFile: boolean
  canChangeState: boolean
  initialReportId: string | null
}) {
  const [reports, setReports] = useState<ReportView[] | null>(null)
  const [error, setError] = useState<string | null>(null)
  const [state, setState] = useState<ReportState | ''>('')
  const [kind, setKind] = useState<ReportKind | ''>('')
  const [tester, setTester] = useState('')
  const [sort, setSort] = useState<'newest' | 'oldest'>('newest')
  const [openId, setOpenId] = useState<string | null>(initialReportId)
  const [testers, setTesters] = useState<Map<string, string>>(new Map())

  const load = useCallback(async () => {
    const query = new URLSearchParams({ sort, ...(state ? { state } : {}), ...(kind ? { kind } : {}), ...(tester ? { tester } : {}) })
    try {
      const answer = await apiFetch(`/api/patterns/${patternId}/reports?${query}`, { schema: reportListAnswerSchema })
      setReports(answer.reports)
      // Everyone who has filed stays in the tester filter, whatever the filter shows now.
      setTesters((known) => {
        const next = new Map(known)
        for (const report of answer.reports) if (report.tester) next.set(report.tester.id, report.tester.displayName)
        return next
      })
      setError(null)
    } catch (caught) {
      setError((caught as Error).message)
    }
  }, [patternId, state, kind, tester, sort])

  useEffect(() => {
    // Loading from the API when the filters change: the table follows the server's answer.
    // eslint-disable-next-line react-hooks/set-state-in-effect -- the fetch sets state once it answers
    void load()
  }, [load])

  const replace = (changed: ReportView) => setReports((list) => (list ?? []).map((report) => (report.id === changed.id ? changed : report)))
  const open = useMemo(() => reports?.find((report) => report.id === openId) ?? null, [reports, openId])

  return (
    <div className="space-y-6">
      <Link href={canChangeState ? `/patterns/${patternId}` : '/'} className="text-sm text-thread-700 hover:underline">
        ← {canChangeState ? patternName : 'Home'}
      </Link>
      <h1 className="text-2xl font-semibold text-thread-800">Test reports: {patternName}</h1>
      {canFile && (
        <section aria-labelledby="file-heading" className="space-y-3 rounded-lg border border-linen-200 bg-white p-5">
          <h2 id="file-heading" className="text-lg font-semibold">
            Report a problem
          </h2>
          <p className="max-w-2xl text-sm text-stone-600">
            Say where: an area by its label (as printed on the foundations), a step of the sewing order, a page of the booklet, or a point you click on the ring.
          </p>
          <ReportForm
            patternId={patternId}
            areas={areas}
            map={map}
            onFiled={(report) => {
              setReports((list) => [report, ...(list ?? [])])
              setOpenId(report.id)
            }}
          />
        </section>
      )}
      <section aria-labelledby="reports-heading" className="space-y-3">
        <h2 id="reports-heading" className="text-lg font-semibold">
          Reports
        </h2>
        <div className="flex flex-wrap gap-3" role="group" aria-label="Filter and sort">
          <label className="flex items-center gap-1 text-sm">
            State
            <select value={state} onChange={(event) => setState(event.target.value as ReportState | '')} className={control}>
              <option value="">all</option>
              <option value="open">open</option>
              <option value="resolved">resolved</option>
            </select>
          </label>
          <label className="flex items-center gap-1 text-sm">
            Kind
            <select value={kind} onChange={(event) => setKind(event.target.value as ReportKind | '')} className={control}>
              <option value="">all</option>
              {REPORT_KINDS.map((value) => (
                <option key={value} value={value}>
                  {REPORT_KIND_NAMES[value]}
                </option>
              ))}
            </select>
          </label>
          <label className="flex items-center gap-1 text-sm">
            Tester
            <select value={tester} onChange={(event) => setTester(event.target.value)} className={control}>
              <option value="">all</option>
              {[...testers].map(([id, name]) => (
                <option key={id} value={id}>
                  {name}
                </option>
              ))}
            </select>
          </label>
          <label className="flex items-center gap-1 text-sm">
            Date
            <select value={sort} onChange={(event) => setSort(event.target.value as 'newest' | 'oldest')} className={control}>
              <option value="newest">newest first</option>
              <option value="oldest">oldest first</option>
            </select>
          </label>
        </div>
        {error && (
          <p role="alert" className="text-sm text-madder-700">
            {error}
          </p>
        )}
        {reports === null ? (
          <p className="text-sm text-stone-500">Loading…</p>
        ) : reports.length === 0 ? (
          <p className="text-sm text-stone-500">No reports{state || kind || tester ? ' match these filters' : ' yet'}.</p>
        ) : (
          <table className="w-full text-left text-sm">
            <thead className="border-b border-linen-200 text-stone-500">
              <tr>
                <th className="py-1 pr-3 font-medium">Filed</th>
                <th className="py-1 pr-3 font-medium">Tester</th>
                <th className="py-1 pr-3 font-medium">Kind</th>
                <th className="py-1 pr-3 font-medium">Severity</th>
                <th className="py-1 pr-3 font-medium">Where</th>
                <th className="py-1 pr-3 font-medium">State</th>
                <th className="py-1 pr-3 font-medium">Answers</th>
              </tr>
            </thead>
            <tbody>
              {reports.map((report) => (
                <tr key={report.id} className={report.id === openId ? 'bg-linen-100' : 'hover:bg-linen-50'} data-testid="report-row">
                  <td className="py-1 pr-3">
                    <button type="button" className="text-thread-700 underline" onClick={() => setOpenId(report.id === openId ? null : report.id)}>
                      <time dateTime={report.createdAt}>{new Date(report.createdAt).toLocaleDateString()}</time>
                    </button>
                  </td>
                  <td className="py-1 pr-3">{report.tester?.displayName ?? '—'}</td>
                  <td className="py-1 pr-3">{REPORT_KIND_NAMES[report.kind]}</td>
                  <td className="py-1 pr-3">{REPORT_SEVERITY_NAMES[report.severity]}</td>
                  <td className="py-1 pr-3">
                    {placeInWords(report.place)}
                    {report.changedSince ? ' (changed since)' : ''}
                  </td>
                  <td className="py-1 pr-3">{report.state}</td>
                  <td className="py-1 pr-3">{report.messages.length}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </section>
      {open && (
        <section aria-label="Report and its thread" className="rounded-lg border border-linen-200 bg-white p-5">
          <ReportThread report={open} canChangeState={canChangeState} onChange={replace} />
        </section>
      )}
    </div>
  )
}
