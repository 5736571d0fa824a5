'use client'

import { useRouter } from 'next/navigation'
import { useRef, useState, type ChangeEvent, type FormEvent } from 'react'
import { sendImage, tooLarge } from '@/components/board/upload-image'
import { ApiError, apiFetch } from '@/lib/api-client'
import { errorsByField } from '@/lib/form-errors'
import { MAX_SKILL_NOTES_LENGTH } from '@/lib/limits'
import { listingSettingsAnswerSchema, listingSettingsSchema, type ListingSettings, type ListingSettingsInput } from '@/lib/schemas/listing-settings'

const UNREACHABLE = 'Could not reach Wreathwright. Try again.'

/**
 * The pattern's listing in the shop, as its designer sets it: the skill notes (what the pattern
 * asks of a quilter) and an optional uploaded cover, shown in the shop instead of the ring drawn
 * from the design. Each change is sent on its own (`PATCH /api/patterns/:id/listing`); a cover is
 * uploaded first (`POST /api/uploads?kind=cover`), then named. Fields refused by the schema (here
 * or on the server) show their message beside them.
 *
 * @example <ListingSettingsForm patternId={pattern.id} settings={settings} />
 */
export function ListingSettingsForm({ patternId, settings }: { patternId: string; settings: ListingSettings }) {
  const router = useRouter()
  const [current, setCurrent] = useState(settings)
  const [errors, setErrors] = useState<Record<string, string>>({})
  const [message, setMessage] = useState<string | null>(null)
  const [busy, setBusy] = useState(false)
  const [progress, setProgress] = useState<number | null>(null)
  const [length, setLength] = useState(settings.skillNotes?.length ?? 0)
  const fileInput = useRef<HTMLInputElement>(null)

  /** Sends one change; returns whether it was saved. */
  async function save(input: ListingSettingsInput, done: string): Promise<boolean> {
    const parsed = listingSettingsSchema.safeParse(input)
    if (!parsed.success) {
      setErrors(errorsByField(parsed.error.issues))
      return false
    }
    setErrors({})
    setMessage(null)
    setBusy(true)
    try {
      const { listing } = await apiFetch(`/api/patterns/${patternId}/listing`, { method: 'PATCH', json: parsed.data, schema: listingSettingsAnswerSchema })
      setCurrent(listing)
      setMessage(done)
      router.refresh()
      return true
    } catch (caught) {
      if (caught instanceof ApiError) {
        setErrors(errorsByField(caught.issues))
        setMessage(caught.message)
      } else setMessage(UNREACHABLE)
      return false
    } finally {
      setBusy(false)
    }
  }

  async function onSubmitNotes(event: FormEvent<HTMLFormElement>): Promise<void> {
    event.preventDefault()
    await save({ skillNotes: String(new FormData(event.currentTarget).get('skillNotes') ?? '') }, 'Skill notes saved.')
  }

  async function onChooseCover(event: ChangeEvent<HTMLInputElement>): Promise<void> {
    const file = event.currentTarget.files?.[0]
    event.currentTarget.value = ''
    if (!file) return
    setMessage(null)
    const refusal = tooLarge(file.size, 'image')
    if (refusal) return setErrors({ coverUploadId: refusal })
    setErrors({})
    setBusy(true)
    setProgress(0)
    let uploadId: string
    try {
      uploadId = (await sendImage(file, 'cover', 'image', setProgress)).id
    } catch (caught) {
      setErrors({ coverUploadId: caught instanceof Error ? caught.message : UNREACHABLE })
      return
    } finally {
      setBusy(false)
      setProgress(null)
    }
    await save({ coverUploadId: uploadId }, 'Cover saved: the shop shows it.')
  }

  return (
    <div className="space-y-5" data-testid="listing-settings">
      <form onSubmit={(event) => void onSubmitNotes(event)} noValidate className="max-w-2xl space-y-2" aria-label="Skill notes">
        <label htmlFor="skill-notes" className="block text-sm font-medium text-stone-700">
          Skill notes
        </label>
        <p id="skill-notes-hint" className="text-sm text-stone-600">
          What the pattern asks of a quilter, shown with it in the shop: the techniques, and who it suits.
        </p>
        <textarea
          id="skill-notes"
          name="skillNotes"
          rows={4}
          defaultValue={current.skillNotes ?? ''}
          onChange={(event) => setLength(event.currentTarget.value.length)}
          aria-invalid={errors.skillNotes ? true : undefined}
          aria-describedby={errors.skillNotes ? 'skill-notes-hint skill-notes-error' : 'skill-notes-hint'}
          className="w-full rounded border border-stone-300 bg-white px-3 py-2 aria-invalid:border-madder-600"
        />
        <p className={`text-xs ${length > MAX_SKILL_NOTES_LENGTH ? 'text-madder-700' : 'text-stone-500'}`} data-testid="skill-notes-length">
          {length} of {MAX_SKILL_NOTES_LENGTH} characters
        </p>
        {errors.skillNotes && (
          <p id="skill-notes-error" className="text-sm text-madder-700">
            {errors.skillNotes}
          </p>
        )}
        <button type="submit" disabled={busy} className="rounded bg-thread-700 px-4 py-2 text-white hover:bg-thread-800 disabled:opacity-60">
          Save the skill notes
        </button>
      </form>

      <div className="space-y-2" role="group" aria-labelledby="cover-label">
        <p id="cover-label" className="text-sm font-medium text-stone-700">
          Cover
        </p>
        <div className="flex flex-wrap items-start gap-4">
          {current.cover ? (
            // eslint-disable-next-line @next/next/no-img-element -- the stored cover, already at its shown size
            <img src={current.cover.url} alt="The pattern’s cover" className="aspect-square w-40 rounded border border-stone-300 object-cover" data-testid="cover-preview" />
          ) : (
            <p className="w-40 text-sm text-stone-600" data-testid="no-cover">
              No cover uploaded: the shop shows the ring drawn in its first colourway.
            </p>
          )}
          <div className="space-y-2">
            <input ref={fileInput} id="cover-file" type="file" accept="image/jpeg,image/png,image/webp" className="sr-only" onChange={(event) => void onChooseCover(event)} aria-label="Cover image file" />
            <button
              type="button"
              disabled={busy}
              onClick={() => fileInput.current?.click()}
              className="block rounded border border-stone-300 px-3 py-1.5 text-sm hover:bg-linen-100 disabled:opacity-60"
            >
              {current.cover ? 'Replace the cover…' : 'Upload a cover…'}
            </button>
            {current.cover && (
              <button
                type="button"
                disabled={busy}
                onClick={() => void save({ coverUploadId: null }, 'Cover removed: the shop shows the drawn ring again.')}
                className="block rounded border border-stone-300 px-3 py-1.5 text-sm hover:bg-linen-100 disabled:opacity-60"
              >
                Remove the cover
              </button>
            )}
            <p className="max-w-xs text-xs text-stone-500">JPEG, PNG or WebP, at most 10 MB; the shop shows it square.</p>
            {progress !== null && (
              <progress value={progress} max={1} className="w-40" aria-label="Uploading the cover">
                {Math.round(progress * 100)} %
              </progress>
            )}
          </div>
        </div>
        {errors.coverUploadId && (
          <p role="alert" className="text-sm text-madder-700">
            {errors.coverUploadId}
          </p>
        )}
      </div>
      {message && (
        <p role="status" className="text-sm text-stone-700" data-testid="listing-message">
          {message}
        </p>
      )}
    </div>
  )
}
