'use client'

import Link from 'next/link'
import { useMemo, useState, type FormEvent } from 'react'
import useSWR from 'swr'
import { ApiError, apiFetch, getJsonOf } from '@/lib/api-client'
import {
  createPatternSchema, patternAnswerSchema, patternListAnswerSchema, patternNameSchema, type PatternSummary,
} from '@/lib/schemas/pattern'
import { ringInWords } from './ring-in-words'
import { sortPatterns, type ShelfColumn, type SortDirection } from './sort-patterns'

const COLUMNS: readonly { key: ShelfColumn; label: string }[] = [
  { key: 'name', label: 'Name' },
  { key: 'state', label: 'State' },
  { key: 'updatedAt', label: 'Last change' },
]

const STATE_LABELS: Record<PatternSummary['state'], string> = {
  draft: 'Draft',
  testing: 'With testers',
  published: 'In the shop',
  retired: 'Retired',
}

/** The shelf's list, read through its schema: a malformed answer is an error shown, not a crash. */
const getPatternList = getJsonOf(patternListAnswerSchema)

function messageOf(error: unknown): string {
  return error instanceof ApiError ? error.message : 'Could not reach Wreathwright. Try again.'
}

/** The designer's patterns as a sortable table, with create, rename and delete. */
export function PatternShelf() {
  const { data, error, isLoading, mutate } = useSWR('/api/patterns', getPatternList)
  const [sort, setSort] = useState<{ column: ShelfColumn; direction: SortDirection }>({ column: 'updatedAt', direction: 'descending' })
  const [notice, setNotice] = useState<string | null>(null)
  const rows = useMemo(() => sortPatterns(data?.patterns ?? [], sort.column, sort.direction), [data, sort])

  function toggleSort(column: ShelfColumn) {
    setSort((current) =>
      current.column === column
        ? { column, direction: current.direction === 'ascending' ? 'descending' : 'ascending' }
        : { column, direction: column === 'updatedAt' ? 'descending' : 'ascending' },
    )
  }

  async function remove(pattern: PatternSummary) {
    if (!window.confirm(`Delete “${pattern.name}” and all its saved revisions? This cannot be undone.`)) return
    try {
      await apiFetch(`/api/patterns/${pattern.id}`, { method: 'DELETE' })
      setNotice(`Deleted “${pattern.name}”.`)
    } catch (cause) {
      setNotice(messageOf(cause))
    }
    await mutate()
  }

  return (
    <div className="space-y-6">
      <CreatePatternForm onCreated={async (name) => { setNotice(`Created “${name}”.`); await mutate() }} />
      <p role="status" aria-live="polite" className="min-h-5 text-sm text-thread-700">
        {notice}
      </p>
      {error && <p role="alert" className="text-madder-700">{messageOf(error)}</p>}
      {isLoading ? (
        <p className="text-stone-500">Loading your patterns…</p>
      ) : rows.length === 0 ? (
        <p className="text-stone-600">No patterns yet. Name your first ring above to start drafting.</p>
      ) : (
        <table className="w-full border-collapse overflow-hidden rounded-lg bg-white text-left shadow-sm">
          <caption className="sr-only">Your patterns; select a column heading to sort.</caption>
          <thead className="bg-linen-100 text-sm text-stone-700">
            <tr>
              {COLUMNS.map(({ key, label }) => (
                <th key={key} scope="col" aria-sort={sort.column === key ? sort.direction : 'none'} className="px-4 py-2">
                  <button type="button" onClick={() => toggleSort(key)} className="font-semibold hover:text-thread-700">
                    {label} {sort.column === key ? (sort.direction === 'ascending' ? '▲' : '▼') : ''}
                  </button>
                </th>
              ))}
              <th scope="col" className="px-4 py-2 font-semibold">
                Ring
              </th>
              <th scope="col" className="px-4 py-2 text-right">
                <span className="sr-only">Actions</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {rows.map((pattern) => (
              <PatternRow
                key={pattern.id}
                pattern={pattern}
                onRenamed={async (name) => { setNotice(`Renamed to “${name}”.`); await mutate() }}
                onProblem={async (text) => { setNotice(text); await mutate() }}
                onDelete={() => remove(pattern)}
              />
            ))}
          </tbody>
        </table>
      )}
    </div>
  )
}

function CreatePatternForm({ onCreated }: { onCreated: (name: string) => Promise<void> }) {
  const [error, setError] = useState<string | null>(null)
  const [busy, setBusy] = useState(false)

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault()
    const formElement = event.currentTarget
    const parsed = createPatternSchema.safeParse({ name: new FormData(formElement).get('name') })
    if (!parsed.success) return setError(parsed.error.issues[0]?.message ?? 'Check the name.')
    setError(null)
    setBusy(true)
    try {
      await apiFetch('/api/patterns', { method: 'POST', json: parsed.data, schema: patternAnswerSchema })
      formElement.reset()
      await onCreated(parsed.data.name)
    } catch (cause) {
      setError(messageOf(cause))
    } finally {
      setBusy(false)
    }
  }

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-wrap items-end gap-3">
      <div className="flex flex-col gap-1">
        <label htmlFor="new-pattern-name" className="text-sm font-medium text-stone-700">
          New pattern
        </label>
        <input
          id="new-pattern-name"
          name="name"
          placeholder="e.g. Winterberry ring"
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? 'new-pattern-error' : undefined}
          className="w-72 rounded border border-stone-300 bg-white px-3 py-2"
        />
      </div>
      <button type="submit" disabled={busy} className="rounded bg-thread-700 px-4 py-2 text-white hover:bg-thread-800 disabled:opacity-60">
        Create pattern
      </button>
      {error && (
        <p id="new-pattern-error" className="w-full text-sm text-madder-700">
          {error}
        </p>
      )}
    </form>
  )
}

function PatternRow({
  pattern,
  onRenamed,
  onProblem,
  onDelete,
}: {
  pattern: PatternSummary
  onRenamed: (name: string) => Promise<void>
  onProblem: (message: string) => Promise<void>
  onDelete: () => void
}) {
  const [editing, setEditing] = useState(false)
  const [error, setError] = useState<string | null>(null)

  async function rename(event: FormEvent<HTMLFormElement>) {
    event.preventDefault()
    const parsed = patternNameSchema.safeParse(new FormData(event.currentTarget).get('name'))
    if (!parsed.success) return setError(parsed.error.issues[0]?.message ?? 'Check the name.')
    try {
      await apiFetch(`/api/patterns/${pattern.id}`, { method: 'PATCH', json: { revision: pattern.revision, name: parsed.data }, schema: patternAnswerSchema })
      setEditing(false)
      setError(null)
      await onRenamed(parsed.data)
    } catch (cause) {
      if (cause instanceof ApiError && cause.status === 409) {
        setEditing(false)
        await onProblem(`“${pattern.name}” was changed elsewhere; the shelf now shows the latest. Rename it again if you still want to.`)
      } else setError(messageOf(cause))
    }
  }

  return (
    <tr className="border-t border-linen-100" data-testid="pattern-row">
      <td className="px-4 py-2">
        {editing ? (
          <form onSubmit={rename} className="flex items-center gap-2">
            <label htmlFor={`rename-${pattern.id}`} className="sr-only">
              New name for {pattern.name}
            </label>
            <input
              id={`rename-${pattern.id}`}
              name="name"
              defaultValue={pattern.name}
              autoFocus
              onKeyDown={(event) => event.key === 'Escape' && setEditing(false)}
              className="rounded border border-stone-300 px-2 py-1"
            />
            <button type="submit" className="rounded bg-thread-700 px-2 py-1 text-sm text-white">
              Save name
            </button>
            <button type="button" onClick={() => setEditing(false)} className="text-sm text-stone-600">
              Cancel
            </button>
            {error && <span className="text-sm text-madder-700">{error}</span>}
          </form>
        ) : (
          <Link href={`/patterns/${pattern.id}`} className="font-medium text-thread-800 hover:underline">
            {pattern.name}
          </Link>
        )}
      </td>
      <td className="px-4 py-2 text-sm">{STATE_LABELS[pattern.state]}</td>
      <td className="px-4 py-2 text-sm text-stone-600">
        <time dateTime={pattern.updatedAt}>{new Date(pattern.updatedAt).toLocaleString()}</time>
      </td>
      <td className="px-4 py-2 text-sm text-stone-600">{ringInWords(pattern)}</td>
      <td className="space-x-3 px-4 py-2 text-right text-sm">
        <button type="button" onClick={() => setEditing(true)} className="text-thread-700 hover:underline" aria-label={`Rename ${pattern.name}`}>
          Rename
        </button>
        <button type="button" onClick={onDelete} className="text-madder-700 hover:underline" aria-label={`Delete ${pattern.name}`}>
          Delete
        </button>
      </td>
    </tr>
  )
}
