'use client'

import { useRouter } from 'next/navigation'
import { useId, useState, type FormEvent } from 'react'
import { ZodError } from 'zod'
import { ApiError } from '@/lib/api-client'
import { PAPER_NAMES } from '@/lib/schemas/booklet'
import { newProjectSchema } from '@/lib/schemas/sewing-room'
import { startProject } from '@/lib/sewing-room-client/api'
import { PAPER_LABELS } from './paper-labels'

export interface ColorwayChoice {
  readonly index: number
  readonly name: string
  readonly fabrics: readonly { readonly role: string; readonly name: string; readonly color: string }[]
}

/**
 * Starting a project: the colourway (each shown with swatches of its fabrics), the finished
 * diameter, the paper the foundations are printed on, and a name to tell two makes of one pattern
 * apart. Checked with the server's own schema before it is sent.
 */
export function StartProjectForm({
  grant,
  colorways,
  designDiameterIn,
  suggestedName,
}: {
  grant: { licenceId: string } | { invitationId: string }
  colorways: readonly ColorwayChoice[]
  designDiameterIn: number
  suggestedName?: string
}) {
  const router = useRouter()
  const id = useId()
  const [problems, setProblems] = useState<Record<string, string>>({})
  const [busy, setBusy] = useState(false)

  const submit = async (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault()
    const form = new FormData(event.currentTarget)
    const name = String(form.get('name') ?? '').trim()
    const parsed = newProjectSchema.safeParse({
      ...grant,
      colorway: Number(form.get('colorway') ?? 0),
      diameterIn: Number(form.get('diameterIn')),
      paper: form.get('paper'),
      ...(name !== '' && { name }),
    })
    if (!parsed.success) {
      setProblems(issuesOf(parsed.error))
      return
    }
    setProblems({})
    setBusy(true)
    try {
      const project = await startProject(parsed.data)
      router.push(`/sewing-room/${project.id}`)
    } catch (error) {
      setBusy(false)
      if (error instanceof ApiError) {
        const fields = Object.fromEntries(error.issues.map((issue) => [issue.path, issue.message]))
        setProblems({ ...fields, form: error.message })
      } else if (error instanceof ZodError) setProblems(issuesOf(error))
      else setProblems({ form: 'The server could not be reached. Try again in a moment.' })
    }
  }

  const problem = (field: string) =>
    problems[field] ? (
      <p id={`${id}-${field}-problem`} className="text-sm text-madder-700">
        {problems[field]}
      </p>
    ) : null

  return (
    <form onSubmit={submit} noValidate className="space-y-6" aria-label="Start a project">
      <fieldset className="space-y-3" aria-describedby={problems.colorway ? `${id}-colorway-problem` : undefined}>
        <legend className="mb-2 text-base font-semibold text-stone-900">Colourway</legend>
        {colorways.length === 0 ? (
          <p className="text-stone-600">
            This pattern has one set of fabrics.
            <input type="hidden" name="colorway" value="0" />
          </p>
        ) : (
          <div className="grid gap-3 sm:grid-cols-2">
            {colorways.map((colorway) => (
              <label
                key={colorway.index}
                className="flex min-h-16 cursor-pointer items-center gap-3 rounded-xl border-2 border-linen-200 bg-white p-3 has-checked:border-thread-700 has-checked:bg-linen-50 has-focus-visible:outline-2 has-focus-visible:outline-thread-700"
              >
                <input type="radio" name="colorway" value={colorway.index} defaultChecked={colorway.index === 0} className="size-5 accent-thread-700" />
                <span className="min-w-0 flex-1">
                  <span className="block font-medium text-stone-900">{colorway.name}</span>
                  <Swatches fabrics={colorway.fabrics} />
                </span>
              </label>
            ))}
          </div>
        )}
        {problem('colorway')}
      </fieldset>

      <div className="grid gap-4 sm:grid-cols-2">
        <div className="flex flex-col gap-1">
          <label htmlFor={`${id}-diameter`} className="text-base font-semibold text-stone-900">
            Finished diameter (inches)
          </label>
          <input
            id={`${id}-diameter`}
            name="diameterIn"
            type="number"
            inputMode="decimal"
            min="1"
            max="200"
            step="0.25"
            defaultValue={designDiameterIn}
            aria-invalid={problems.diameterIn ? true : undefined}
            aria-describedby={problems.diameterIn ? `${id}-diameterIn-problem` : `${id}-diameter-hint`}
            className="min-h-12 rounded-lg border border-stone-300 bg-white px-3 text-lg"
          />
          <p id={`${id}-diameter-hint`} className="text-sm text-stone-600">
            As designed: {designDiameterIn} in. The rough-cut sizes follow the size you choose.
          </p>
          {problem('diameterIn')}
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor={`${id}-paper`} className="text-base font-semibold text-stone-900">
            Paper
          </label>
          <select id={`${id}-paper`} name="paper" defaultValue="letter" className="min-h-12 rounded-lg border border-stone-300 bg-white px-3 text-lg">
            {PAPER_NAMES.map((paper) => (
              <option key={paper} value={paper}>
                {PAPER_LABELS[paper]}
              </option>
            ))}
          </select>
          {problem('paper')}
        </div>
      </div>

      <div className="flex flex-col gap-1">
        <label htmlFor={`${id}-name`} className="text-base font-semibold text-stone-900">
          Name (optional)
        </label>
        <input
          id={`${id}-name`}
          name="name"
          type="text"
          maxLength={200}
          placeholder={suggestedName}
          aria-describedby={`${id}-name-hint`}
          className="min-h-12 rounded-lg border border-stone-300 bg-white px-3 text-lg"
        />
        <p id={`${id}-name-hint`} className="text-sm text-stone-600">
          Making it twice? A name tells the two apart (“For Mum’s door”).
        </p>
        {problem('name')}
      </div>

      {problems.form && (
        <p role="alert" className="rounded-lg border border-madder-600/40 bg-white p-3 text-madder-700">
          {problems.form}
        </p>
      )}
      {problems.licenceId && <p className="text-sm text-madder-700">{problems.licenceId}</p>}
      <button type="submit" disabled={busy} className="min-h-14 w-full rounded-xl bg-thread-700 px-6 text-lg font-semibold text-white hover:bg-thread-800 disabled:opacity-60 sm:w-auto">
        {busy ? 'Starting…' : 'Start the project'}
      </button>
    </form>
  )
}

/** A colourway's fabrics as a row of round swatches (SVG, so the colours are attributes, not styles). */
function Swatches({ fabrics }: { fabrics: ColorwayChoice['fabrics'] }) {
  const size = 22
  return (
    <span className="mt-1 flex flex-wrap items-center gap-1" data-testid="colorway-swatches">
      {fabrics.map((fabric) => (
        <svg key={fabric.role} width={size} height={size} viewBox="0 0 22 22" role="img" aria-label={fabric.name}>
          <title>{fabric.name}</title>
          <circle cx={11} cy={11} r={10} fill={fabric.color} stroke="#78716c" strokeWidth={1} />
        </svg>
      ))}
    </span>
  )
}

function issuesOf(error: ZodError): Record<string, string> {
  const problems: Record<string, string> = {}
  for (const issue of error.issues) {
    const path = issue.path.map(String).join('.') || 'form'
    problems[path] ??= issue.message
  }
  return problems
}
