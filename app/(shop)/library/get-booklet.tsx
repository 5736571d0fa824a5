'use client'

import { useEffect, useRef, useState, type FormEvent } from 'react'
import { ApiError, apiFetch } from '@/lib/api-client'
import { PAPER_NAMES } from '@/lib/schemas/booklet'
import { BOOKLET_ASK_AGAIN_MS, bookletRequestSchema, bookletStatusSchema, type BookletStatus } from '@/lib/schemas/booklet-builds'

const PAPER_LABELS: Record<(typeof PAPER_NAMES)[number], string> = { letter: 'Letter', legal: 'Legal', tabloid: 'Tabloid', a4: 'A4', a3: 'A3' }

/**
 * "Get the booklet" for one licence: the buyer picks paper, orientation, colourway and size; the
 * server builds the booklet with their name and licence number on every page (a worker, off the
 * web process); the page shows its progress, then a download link that works for a few minutes.
 */
export function GetBooklet({ licenceId, patternName }: { licenceId: string; patternName: string }) {
  const [open, setOpen] = useState(false)
  const [colorways, setColorways] = useState<string[] | null>(null)
  const [status, setStatus] = useState<BookletStatus | null>(null)
  const [problem, setProblem] = useState<string | null>(null)
  const [busy, setBusy] = useState(false)
  const timer = useRef<ReturnType<typeof setTimeout> | undefined>(undefined)

  useEffect(() => () => clearTimeout(timer.current), [])

  useEffect(() => {
    if (!open || colorways) return
    apiFetch<{ pattern: { design: { colorways?: { name: string }[] } } }>(`/api/library/${licenceId}`)
      .then((answer) => setColorways((answer.pattern.design.colorways ?? []).map((colorway) => colorway.name)))
      .catch(() => setColorways([]))
  }, [open, colorways, licenceId])

  /** Asks how the build is going after the wait the server asked for (BOOKLET_ASK_AGAIN_MS). */
  const follow = (id: string, waitMs: number) => {
    clearTimeout(timer.current)
    timer.current = setTimeout(() => {
      apiFetch(`/api/booklets/${id}`, { schema: bookletStatusSchema })
        .then((next) => {
          setStatus(next)
          if (next.state === 'queued' || next.state === 'building') follow(id, next.askAgainMs ?? BOOKLET_ASK_AGAIN_MS.building)
        })
        .catch((error: unknown) => setProblem(error instanceof ApiError ? error.message : 'The server could not be reached.'))
    }, waitMs)
  }

  const submit = async (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault()
    const form = new FormData(event.currentTarget)
    const size = String(form.get('diameterIn') ?? '').trim()
    const parsed = bookletRequestSchema.safeParse({
      paper: form.get('paper'),
      orientation: form.get('orientation'),
      colorway: form.get('colorway') || undefined,
      diameterIn: size === '' ? undefined : Number(size),
    })
    if (!parsed.success) {
      setProblem(parsed.error.issues.map((issue) => `${issue.path.join('.')}: ${issue.message}`).join('; '))
      return
    }
    setProblem(null)
    setBusy(true)
    try {
      const answer = await apiFetch(`/api/licences/${licenceId}/booklets`, { method: 'POST', json: parsed.data, schema: bookletStatusSchema })
      setStatus(answer)
      if (answer.state === 'queued' || answer.state === 'building') follow(answer.id, answer.askAgainMs ?? BOOKLET_ASK_AGAIN_MS.building)
    } catch (error) {
      setProblem(error instanceof ApiError ? [error.message, ...error.issues.map((issue) => `${issue.path}: ${issue.message}`)].join(' ') : 'The server could not be reached.')
    } finally {
      setBusy(false)
    }
  }

  if (!open) {
    return (
      <button type="button" onClick={() => setOpen(true)} className="text-thread-700 hover:underline">
        Get the booklet
      </button>
    )
  }
  const building = status?.state === 'queued' || status?.state === 'building'
  return (
    <div className="mt-2 basis-full space-y-2 rounded border border-linen-200 bg-white p-3" data-testid="get-booklet">
      <form onSubmit={submit} className="flex flex-wrap items-end gap-3" aria-label={`Booklet of ${patternName}`}>
        <label className="flex flex-col gap-1 text-xs text-stone-700">
          Paper
          <select name="paper" defaultValue="letter" className="rounded border border-stone-300 px-2 py-1">
            {PAPER_NAMES.map((paper) => (
              <option key={paper} value={paper}>
                {PAPER_LABELS[paper]}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col gap-1 text-xs text-stone-700">
          Orientation
          <select name="orientation" defaultValue="portrait" className="rounded border border-stone-300 px-2 py-1">
            <option value="portrait">Portrait</option>
            <option value="landscape">Landscape</option>
          </select>
        </label>
        <label className="flex flex-col gap-1 text-xs text-stone-700">
          Colourway
          <select name="colorway" className="rounded border border-stone-300 px-2 py-1" disabled={!colorways}>
            {(colorways ?? []).map((name) => (
              <option key={name} value={name}>
                {name}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col gap-1 text-xs text-stone-700">
          Finished size (in)
          <input name="diameterIn" type="number" min="1" max="200" step="0.25" placeholder="as designed" className="w-28 rounded border border-stone-300 px-2 py-1" />
        </label>
        <button type="submit" disabled={busy || building} className="rounded bg-thread-700 px-3 py-1.5 text-sm font-medium text-white disabled:opacity-60">
          Build my booklet
        </button>
      </form>
      <div aria-live="polite" className="text-sm text-stone-700">
        {building && (
          <p data-testid="booklet-progress">
            {status!.state === 'queued' ? 'Waiting for the booklet builder…' : `Building… page ${status!.progress?.pages ?? 0}`}
          </p>
        )}
        {status?.state === 'ready' && status.url && (
          <p>
            <a href={status.url} className="font-medium text-thread-700 underline" data-testid="booklet-download">
              Download the booklet (PDF, {status.progress?.pages ?? '?'} pages)
            </a>{' '}
            <span className="text-xs text-stone-500">The link works for a few minutes; build it again for a new one (it is kept).</span>
          </p>
        )}
        {status?.state === 'failed' && <p className="text-madder-700">{status.error}</p>}
        {problem && <p className="text-madder-700">{problem}</p>}
      </div>
    </div>
  )
}
