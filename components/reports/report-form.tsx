'use client'

import { useState, type FormEvent } from 'react'
import { sendImage, tooLarge } from '@/components/board/upload-image'
import { ApiError, apiFetch } from '@/lib/api-client'
import {
  createReportSchema,
  MAX_REPORT_PHOTOS,
  REPORT_KIND_NAMES,
  REPORT_KINDS,
  REPORT_SEVERITIES,
  REPORT_SEVERITY_NAMES,
  reportAnswerSchema,
  type ReportKind,
  type ReportSeverity,
  type ReportMap as ReportMapData,
  type ReportView,
} from '@/lib/schemas/report'
import { ReportMap } from './report-map'

const input = 'rounded border border-stone-300 bg-white px-2 py-1.5 text-sm'

/**
 * A tester's report: what kind of problem, how much it matters, what happened, where (an area of
 * the plan, a step, a booklet page — or the point clicked on the board), and photos. Checked by
 * the same schema as the server's; field messages shown beside their fields.
 */
export function ReportForm({
  patternId,
  areas,
  map,
  onFiled,
}: {
  patternId: string
  /** The plan's area labels in sewing order: step n is the n-th. */
  areas: readonly string[]
  /** The ring's areas to click a point on; null when the design does not read. */
  map: ReportMapData | null
  onFiled: (report: ReportView) => void
}) {
  const [point, setPoint] = useState<[number, number] | null>(null)
  const [kind, setKind] = useState<ReportKind>('fit')
  const [severity, setSeverity] = useState<ReportSeverity>('needs-fixing')
  const [text, setText] = useState('')
  const [area, setArea] = useState('')
  const [step, setStep] = useState('')
  const [page, setPage] = useState('')
  const [photos, setPhotos] = useState<{ id: string; url: string; name: string }[]>([])
  const [uploading, setUploading] = useState<string | null>(null)
  const [issues, setIssues] = useState<Record<string, string>>({})
  const [error, setError] = useState<string | null>(null)
  const [busy, setBusy] = useState(false)

  async function addPhotos(files: FileList | null) {
    for (const file of [...(files ?? [])].slice(0, MAX_REPORT_PHOTOS - photos.length)) {
      const large = tooLarge(file.size, 'photo')
      if (large) {
        setError(large)
        continue
      }
      setUploading(file.name)
      try {
        const upload = await sendImage(file, 'report-photo', 'photo')
        setPhotos((list) => [...list, { id: upload.id, url: upload.url, name: file.name }])
      } catch (caught) {
        setError((caught as Error).message)
      } finally {
        setUploading(null)
      }
    }
  }

  async function submit(event: FormEvent) {
    event.preventDefault()
    setError(null)
    const body = {
      kind,
      severity,
      text,
      place: {
        ...(area ? { area } : {}),
        ...(step ? { step: Number(step) } : {}),
        ...(page ? { page: Number(page) } : {}),
        ...(point ? { point: [point[0], point[1]] } : {}),
      },
      photoIds: photos.map((photo) => photo.id),
    }
    const parsed = createReportSchema.safeParse(body)
    if (!parsed.success) {
      setIssues(Object.fromEntries(parsed.error.issues.map((issue) => [issue.path.map(String).join('.'), issue.message])))
      return
    }
    setIssues({})
    setBusy(true)
    try {
      const answer = await apiFetch(`/api/patterns/${patternId}/reports`, { method: 'POST', json: parsed.data, schema: reportAnswerSchema })
      setText('')
      setArea('')
      setStep('')
      setPage('')
      setPhotos([])
      setPoint(null)
      onFiled(answer.report)
    } catch (caught) {
      if (caught instanceof ApiError && caught.issues.length > 0) setIssues(Object.fromEntries(caught.issues.map((issue) => [issue.path, issue.message])))
      setError(caught instanceof Error ? caught.message : 'The report did not reach the server. Try again.')
    } finally {
      setBusy(false)
    }
  }

  /** The message of a field, or of any field under it (`photoIds` covers `photoIds.1`). */
  const issue = (path: string) => {
    const key = Object.keys(issues).find((candidate) => candidate === path || candidate.startsWith(`${path}.`))
    return key ? (
      <p id={`report-${path}-error`} className="text-sm text-madder-700">
        {issues[key]}
      </p>
    ) : null
  }

  return (
    <form onSubmit={submit} className="space-y-3" aria-label="File a report" noValidate>
      <div className="grid gap-3 sm:grid-cols-2">
        <label className="flex flex-col gap-1 text-sm">
          <span className="font-medium text-stone-700">What kind of problem</span>
          <select value={kind} onChange={(event) => setKind(event.target.value as ReportKind)} className={input}>
            {REPORT_KINDS.map((value) => (
              <option key={value} value={value}>
                {REPORT_KIND_NAMES[value]}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col gap-1 text-sm">
          <span className="font-medium text-stone-700">How much it matters</span>
          <select value={severity} onChange={(event) => setSeverity(event.target.value as ReportSeverity)} className={input}>
            {REPORT_SEVERITIES.map((value) => (
              <option key={value} value={value}>
                {REPORT_SEVERITY_NAMES[value]}
              </option>
            ))}
          </select>
        </label>
      </div>
      <fieldset className="space-y-2">
        <legend className="text-sm font-medium text-stone-700">Where (one or more: an area, a step, a page, a point on the ring)</legend>
        {map && <ReportMap map={map} point={point} onPick={setPoint} />}
        <div className="grid gap-3 sm:grid-cols-3">
          <label className="flex flex-col gap-1 text-sm">
            <span>Area</span>
            <select aria-label="Area" value={area} onChange={(event) => setArea(event.target.value)} className={input} aria-invalid={issues['place.area'] ? true : undefined}>
              <option value="">—</option>
              {areas.map((label) => (
                <option key={label} value={label}>
                  {label}
                </option>
              ))}
            </select>
          </label>
          <label className="flex flex-col gap-1 text-sm">
            <span>Step</span>
            <input aria-label="Step" type="number" min={1} max={areas.length || undefined} value={step} onChange={(event) => setStep(event.target.value)} className={input} />
          </label>
          <label className="flex flex-col gap-1 text-sm">
            <span>Booklet page</span>
            <input aria-label="Booklet page" type="number" min={1} value={page} onChange={(event) => setPage(event.target.value)} className={input} />
          </label>
        </div>
        {issue('place.area')}
        {issue('place.step')}
        {issue('place.page')}
        {issue('place.point')}
      </fieldset>
      <label className="flex flex-col gap-1 text-sm">
        <span className="font-medium text-stone-700">What happened</span>
        <textarea value={text} onChange={(event) => setText(event.target.value)} rows={4} maxLength={4000} className={input} aria-invalid={issues.text ? true : undefined} />
      </label>
      {issue('text')}
      <div className="space-y-1 text-sm">
        <label className="flex flex-col gap-1">
          <span className="font-medium text-stone-700">Photos (JPEG, PNG or WebP; up to {MAX_REPORT_PHOTOS})</span>
          <input type="file" accept="image/jpeg,image/png,image/webp" multiple disabled={photos.length >= MAX_REPORT_PHOTOS || uploading !== null} onChange={(event) => addPhotos(event.target.files)} />
        </label>
        {uploading && <p>Sending {uploading}…</p>}
        {photos.length > 0 && (
          <ul className="flex flex-wrap gap-2" aria-label="Photos to send">
            {photos.map((photo) => (
              <li key={photo.id} className="flex items-center gap-1">
                {/* eslint-disable-next-line @next/next/no-img-element -- a private upload served by our own route */}
                <img src={photo.url} alt={photo.name} className="h-12 w-12 rounded object-cover" />
                <button type="button" className="text-xs text-thread-700 underline" onClick={() => setPhotos((list) => list.filter((p) => p.id !== photo.id))}>
                  Remove
                </button>
              </li>
            ))}
          </ul>
        )}
        {issue('photoIds')}
      </div>
      <button type="submit" disabled={busy || uploading !== null} className="rounded bg-thread-700 px-4 py-2 text-sm text-white hover:bg-thread-800 disabled:opacity-50">
        File the report
      </button>
      {error && (
        <p role="alert" className="text-sm text-madder-700">
          {error}
        </p>
      )}
    </form>
  )
}
