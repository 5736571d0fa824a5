'use client'

import { useRef, useState, type ChangeEvent } from 'react'
import useSWR, { useSWRConfig } from 'swr'
import { z } from 'zod'
import { fabricRoleInWords } from '@/geometry/fabric-requirements'
import { getJsonOf } from '@/lib/api-client'
import type { BoardDesign } from '@/lib/board/commands'
import type { BoardStore } from '@/lib/board/store'
import { uploadListAnswerSchema, uploadViewSchema, type UploadView } from '@/lib/schemas/upload'
import { sendImage, tooLarge } from './upload-image'

type Colorway = BoardDesign['colorways'][number]

const button = 'rounded border border-stone-300 px-2 py-1 text-xs hover:bg-linen-100 disabled:opacity-40'

/** `GET /api/uploads/<id>/palette`: the colours proposed when the photo was uploaded. */
const paletteAnswerSchema = z.object({ palette: uploadViewSchema.shape.palette })
const paletteUrl = (upload: string) => `/api/uploads/${upload}/palette`
/** The designer's own theme photos, newest first (at most 20). */
const LIST_URL = '/api/uploads?kind=fabric-photo'

/**
 * "Theme fabric photo" of the colourway shown: the designer uploads a photo of the fabric that
 * colourway starts from; the server proposes its colours (lib/images.ts) and they are shown as
 * swatches beside the photo. The photo is the colourway's (`themePhoto` in the design, set by
 * `setThemePhoto`: undoable and saved like any change), so another colourway or another pattern
 * shows its own, or none. Choosing a swatch, then a fabric, makes that the fabric's colour in the
 * colourway (`setFabricColour`, one undoable step). A photo that can no longer be read (deleted,
 * or someone else's in an imported file) shows nothing. "Your earlier photos" lists the designer's
 * own to pick one again without uploading it. Give it `key={colorway.name}` so a
 * half-made choice does not follow to another colourway.
 */
export function ThemePhoto({ store, colorway }: { store: BoardStore; colorway: Colorway | undefined }) {
  const photo = colorway?.themePhoto
  const { mutate } = useSWRConfig()
  const { data, error: unreadable } = useSWR(photo ? paletteUrl(photo) : null, getJsonOf(paletteAnswerSchema), { shouldRetryOnError: false })
  const [broken, setBroken] = useState<string | null>(null)
  const [progress, setProgress] = useState<number | null>(null)
  const [error, setError] = useState<string | null>(null)
  const [chosen, setChosen] = useState<string | null>(null)
  const [done, setDone] = useState<string | null>(null)
  const input = useRef<HTMLInputElement>(null)
  const shown = photo && !unreadable && broken !== photo ? photo : null
  const fabrics = Object.entries(colorway?.fabrics ?? {})

  async function upload(event: ChangeEvent<HTMLInputElement>) {
    const file = event.currentTarget.files?.[0]
    event.currentTarget.value = ''
    if (!file || !colorway) return
    setError(null)
    setDone(null)
    setChosen(null)
    const refusal = tooLarge(file.size, 'photo')
    if (refusal) return setError(refusal)
    setProgress(0)
    try {
      const stored = await sendImage(file, 'fabric-photo', 'photo', setProgress)
      // The answer carries the palette: no need to ask for it again.
      await mutate(paletteUrl(stored.id), { palette: stored.palette }, { revalidate: false })
      store.run('setThemePhoto', { colorway: colorway.name, upload: stored.id })
      void mutate(LIST_URL)
    } catch (failure) {
      setError((failure as Error).message)
    } finally {
      setProgress(null)
    }
  }

  function applyColour(fabric: string, name: string) {
    if (!colorway || !chosen) return
    store.run('setFabricColour', { colorway: colorway.name, fabric, colour: chosen })
    setDone(`${name} is now ${chosen} in ${colorway.name}.`)
    setChosen(null)
  }

  async function pick(upload: UploadView) {
    if (!colorway) return
    setError(null)
    setChosen(null)
    setDone(null)
    await mutate(paletteUrl(upload.id), { palette: upload.palette }, { revalidate: false })
    store.run('setThemePhoto', { colorway: colorway.name, upload: upload.id })
  }

  function remove() {
    if (!colorway) return
    setChosen(null)
    setDone(null)
    store.run('setThemePhoto', { colorway: colorway.name, upload: null })
  }

  return (
    <div className="space-y-2 rounded border border-stone-200 bg-white/60 p-2" data-testid="theme-photo" data-photo={shown ?? undefined}>
      <div className="flex items-center justify-between gap-2">
        <h3 className="text-xs font-semibold text-stone-600">Theme fabric photo</h3>
        <button type="button" className={`${button} shrink-0 whitespace-nowrap`} disabled={progress !== null || !colorway} onClick={() => input.current?.click()}>
          {shown ? 'Another photo' : 'Upload a photo'}
        </button>
        <input
          ref={input}
          type="file"
          accept="image/jpeg,image/png,image/webp"
          aria-label="Theme fabric photo (JPEG, PNG or WebP, up to 10 MB)"
          className="sr-only"
          onChange={upload}
        />
      </div>
      {progress !== null && (
        <div className="space-y-1">
          <progress value={progress} max={1} aria-label="Upload progress" className="h-1.5 w-full" />
          <p className="text-[11px] text-stone-500">{progress < 1 ? `Sending… ${Math.round(progress * 100)} %` : 'Reading the colours…'}</p>
        </div>
      )}
      {error && (
        <p role="alert" className="text-xs text-madder-700">
          {error}
        </p>
      )}
      {shown ? (
        <div className="flex gap-2">
          <div className="w-24 shrink-0 space-y-1">
            {/* eslint-disable-next-line @next/next/no-img-element -- a private upload served by the API to its owner, not a file to optimise */}
            <img
              src={`/api/uploads/${shown}`}
              alt={`Theme fabric of ${colorway?.name}`}
              onError={() => setBroken(shown)}
              className="h-auto w-24 rounded border border-stone-300 object-cover"
            />
            <button type="button" className="text-[11px] text-stone-600 underline hover:text-madder-700" onClick={remove}>
              Remove photo
            </button>
          </div>
          <ul className="grid flex-1 grid-cols-4 content-start gap-1" aria-label="Colours of the theme fabric">
            {(data?.palette ?? []).map((colour) => (
              <li key={colour}>
                <button
                  type="button"
                  aria-pressed={chosen === colour}
                  aria-label={`Palette colour ${colour}`}
                  title={colour}
                  onClick={() => (setChosen(chosen === colour ? null : colour), setDone(null))}
                  className="h-6 w-full rounded border border-stone-400 aria-pressed:ring-2 aria-pressed:ring-thread-600"
                  style={{ backgroundColor: colour }}
                />
              </li>
            ))}
          </ul>
        </div>
      ) : (
        progress === null && (
          <p className="text-[11px] text-stone-500">A photo of the fabric {colorway ? `the ${colorway.name} colourway` : 'a colourway'} starts from proposes its colours.</p>
        )
      )}
      {progress === null && colorway && <EarlierPhotos current={shown} onPick={pick} />}
      {chosen && (
        <div className="space-y-1" role="group" aria-label={`Use ${chosen} for a fabric`}>
          <p className="text-[11px] text-stone-600">
            Use <span className="font-mono">{chosen}</span> for:
          </p>
          <div className="flex flex-wrap gap-1">
            {fabrics.map(([fabric, { name }]) => (
              <button key={fabric} type="button" className={button} onClick={() => applyColour(fabric, name)} title={fabricRoleInWords(fabric)}>
                {name}
              </button>
            ))}
          </div>
        </div>
      )}
      {done && (
        <p role="status" className="text-[11px] text-stone-600">
          {done}
        </p>
      )}
    </div>
  )
}

/**
 * The designer's earlier theme photos, to start another colourway (or pattern) from one of them
 * without uploading it again. Asked for only when opened.
 */
function EarlierPhotos({ current, onPick }: { current: string | null; onPick: (upload: UploadView) => void }) {
  const [open, setOpen] = useState(false)
  const { data, error } = useSWR(open ? LIST_URL : null, getJsonOf(uploadListAnswerSchema))
  const earlier = (data?.uploads ?? []).filter((upload) => upload.id !== current)
  return (
    <details onToggle={(event) => setOpen(event.currentTarget.open)} className="text-[11px] text-stone-600">
      <summary className="cursor-pointer">Your earlier photos</summary>
      {error ? (
        <p role="alert" className="mt-1 text-madder-700">Your photos could not be listed: {(error as Error).message}</p>
      ) : !data ? (
        open && <p className="mt-1 text-stone-500">Looking…</p>
      ) : earlier.length === 0 ? (
        <p className="mt-1 text-stone-500">No other photos yet.</p>
      ) : (
        <ul className="mt-1 grid grid-cols-4 gap-1" aria-label="Your earlier theme photos">
          {earlier.map((upload) => (
            <li key={upload.id}>
              <button
                type="button"
                data-upload={upload.id}
                onClick={() => onPick(upload)}
                aria-label={`Use the photo uploaded ${new Date(upload.createdAt).toLocaleString()}`}
                className="block w-full overflow-hidden rounded border border-stone-300 hover:ring-2 hover:ring-thread-600"
              >
                {/* eslint-disable-next-line @next/next/no-img-element -- a private upload served by the API to its owner, not a file to optimise */}
                <img src={upload.url} alt="" className="h-10 w-full object-cover" />
              </button>
            </li>
          ))}
        </ul>
      )}
    </details>
  )
}
