'use client'

import { useState, type FormEvent } from 'react'
import { ApiError, apiFetch } from '@/lib/api-client'
import { placeInWords, REPORT_KIND_NAMES, REPORT_SEVERITY_NAMES, reportAnswerSchema, type ReportView } from '@/lib/schemas/report'

const ROLE_NAMES = { designer: 'designer', tester: 'tester', admin: 'admin' } as const

/**
 * One report with its thread: what the tester said and where, their photos, the answers, a box
 * to answer, and (for the pattern's designer or an admin) resolving and reopening.
 */
export function ReportThread({ report, canChangeState, onChange }: { report: ReportView; canChangeState: boolean; onChange: (report: ReportView) => void }) {
  const [text, setText] = useState('')
  const [error, setError] = useState<string | null>(null)
  const [busy, setBusy] = useState(false)

  async function send(event: FormEvent) {
    event.preventDefault()
    setBusy(true)
    setError(null)
    try {
      const answer = await apiFetch(`/api/reports/${report.id}/messages`, { method: 'POST', json: { text }, schema: reportAnswerSchema })
      setText('')
      onChange(answer.report)
    } catch (caught) {
      setError(caught instanceof ApiError ? (caught.issues[0]?.message ?? caught.message) : 'The answer did not reach the server. Try again.')
    } finally {
      setBusy(false)
    }
  }

  async function setState(state: 'open' | 'resolved') {
    setBusy(true)
    setError(null)
    try {
      onChange((await apiFetch(`/api/reports/${report.id}`, { method: 'PATCH', json: { state }, schema: reportAnswerSchema })).report)
    } catch (caught) {
      setError(caught instanceof Error ? caught.message : 'That did not work. Try again.')
    } finally {
      setBusy(false)
    }
  }

  return (
    <article className="space-y-3" aria-label={`Report on ${placeInWords(report.place)}`} data-testid="report-thread">
      <header className="space-y-1">
        <p className="text-sm text-stone-600">
          {REPORT_KIND_NAMES[report.kind]} · {REPORT_SEVERITY_NAMES[report.severity]} · at {placeInWords(report.place)} · revision {report.revision}
        </p>
        <p className="text-sm">
          <span className={report.state === 'open' ? 'rounded bg-amber-100 px-1.5 py-0.5 text-amber-900' : 'rounded bg-emerald-100 px-1.5 py-0.5 text-emerald-900'} data-testid="report-state">
            {report.state === 'open' ? 'Open' : 'Resolved'}
          </span>{' '}
          by {report.tester?.displayName ?? 'a former tester'}, <time dateTime={report.createdAt}>{new Date(report.createdAt).toLocaleString()}</time>
        </p>
        {report.changedSince && (
          <p role="note" className="rounded border border-amber-300 bg-amber-50 px-2 py-1 text-sm text-amber-900">
            The design has changed here since the report.
          </p>
        )}
      </header>
      <p className="whitespace-pre-wrap">{report.text}</p>
      {report.photos.length > 0 && (
        <ul className="flex flex-wrap gap-2" aria-label="Photos">
          {report.photos.map((photo, index) => (
            <li key={photo.id}>
              <a href={photo.url} target="_blank" rel="noreferrer">
                {/* eslint-disable-next-line @next/next/no-img-element -- a private upload served by our own route, never optimised */}
                <img src={photo.url} alt={`Photo ${index + 1} of the report`} className="h-24 w-24 rounded border border-stone-200 object-cover" />
              </a>
            </li>
          ))}
        </ul>
      )}
      <ol className="space-y-2" aria-label="Answers">
        {report.messages.map((message) => (
          <li key={message.id} className="rounded border border-linen-200 bg-linen-50 p-2 text-sm" data-testid="report-message">
            <p className="text-xs text-stone-500">
              {message.author?.displayName ?? 'A former member'}
              {message.authorRole ? ` (${ROLE_NAMES[message.authorRole]})` : ''}, <time dateTime={message.createdAt}>{new Date(message.createdAt).toLocaleString()}</time>
            </p>
            <p className="whitespace-pre-wrap">{message.text}</p>
          </li>
        ))}
      </ol>
      <form onSubmit={send} className="space-y-2">
        <label htmlFor={`answer-${report.id}`} className="block text-sm font-medium text-stone-700">
          Your answer
        </label>
        <textarea
          id={`answer-${report.id}`}
          value={text}
          onChange={(event) => setText(event.target.value)}
          rows={3}
          maxLength={4000}
          className="w-full rounded border border-stone-300 bg-white px-2 py-1 text-sm"
        />
        <div className="flex flex-wrap gap-2">
          <button type="submit" disabled={busy || text.trim() === ''} className="rounded bg-thread-700 px-3 py-1.5 text-sm text-white hover:bg-thread-800 disabled:opacity-50">
            Send answer
          </button>
          {canChangeState &&
            (report.state === 'open' ? (
              <button type="button" disabled={busy} onClick={() => setState('resolved')} className="rounded border border-stone-300 px-3 py-1.5 text-sm hover:bg-linen-100">
                Mark resolved
              </button>
            ) : (
              <button type="button" disabled={busy} onClick={() => setState('open')} className="rounded border border-stone-300 px-3 py-1.5 text-sm hover:bg-linen-100">
                Reopen
              </button>
            ))}
        </div>
        {error && (
          <p role="alert" className="text-sm text-madder-700">
            {error}
          </p>
        )}
      </form>
    </article>
  )
}
