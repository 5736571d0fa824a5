'use client'

import { useRef, useState, type ChangeEvent } from 'react'
import useSWR from 'swr'
import { fabricRoleInWords } from '@/geometry/fabric-requirements'
import { getJsonOf } from '@/lib/api-client'
import type { BoardDesign } from '@/lib/board/commands'
import type { BoardStore } from '@/lib/board/store'
import { uploadAnswerSchema, uploadListAnswerSchema, type UploadView } from '@/lib/schemas/upload'

type Colorway = BoardDesign['colorways'][number]

/** The largest photo the server accepts (lib/images.ts MAX_UPLOAD_BYTES), checked here first to save the wait. */
const MAX_PHOTO_BYTES = 10 * 1024 * 1024
const LIST_URL = '/api/uploads?kind=fabric-photo'
const button = 'rounded border border-stone-300 px-2 py-1 text-xs hover:bg-linen-100 disabled:opacity-40'

/**
 * Sends the photo as the request body, reporting the share sent so far (fetch cannot report an
 * upload's progress; XMLHttpRequest can). Resolves to the stored upload with its palette; rejects
 * with the server's message, in plain words.
 */
function sendPhoto(file: File, onProgress: (share: number) => void): Promise<UploadView> {
  return new Promise((resolve, reject) => {
    const request = new XMLHttpRequest()
    request.open('POST', '/api/uploads?kind=fabric-photo')
    request.setRequestHeader('content-type', file.type || 'application/octet-stream')
    request.setRequestHeader('accept', 'application/json')
    request.upload.onprogress = (event) => event.lengthComputable && onProgress(event.loaded / event.total)
    request.onload = () => {
      let body: unknown = null
      try {
        body = JSON.parse(request.responseText)
      } catch {
        // Not JSON (a proxy's error page): the status says enough below.
      }
      if (request.status === 201) {
        const parsed = uploadAnswerSchema.safeParse(body)
        return parsed.success ? resolve(parsed.data.upload) : reject(new Error('The server’s answer made no sense.'))
      }
      const message = (body as { error?: { message?: string } } | null)?.error?.message
      reject(new Error(message ?? `The upload was refused (${request.status}).`))
    }
    request.onerror = () => reject(new Error('The photo did not reach the server. Check the connection and try again.'))
    request.send(file)
  })
}

/**
 * "Theme fabric photo": the designer uploads a photo of the fabric a colourway starts from; the
 * server proposes its colours (lib/images.ts) and they are shown as swatches beside the photo.
 * Choosing a swatch, then a fabric, makes that the fabric's colour in the colourway on the board
 * (`setFabricColour`, one undoable step). The latest photo is shown again when the board opens.
 */
export function ThemePhoto({ store, colorway }: { store: BoardStore; colorway: Colorway | undefined }) {
  const { data, mutate } = useSWR(LIST_URL, getJsonOf(uploadListAnswerSchema))
  const [progress, setProgress] = useState<number | null>(null)
  const [error, setError] = useState<string | null>(null)
  const [chosen, setChosen] = useState<string | null>(null)
  const [done, setDone] = useState<string | null>(null)
  const input = useRef<HTMLInputElement>(null)
  const photo = data?.uploads[0]
  const fabrics = Object.entries(colorway?.fabrics ?? {})

  async function upload(event: ChangeEvent<HTMLInputElement>) {
    const file = event.currentTarget.files?.[0]
    event.currentTarget.value = ''
    if (!file) return
    setError(null)
    setDone(null)
    setChosen(null)
    if (file.size > MAX_PHOTO_BYTES) {
      return setError(`The photo is ${(file.size / 1024 / 1024).toFixed(1)} MB; at most 10 MB is accepted. Use a smaller photo.`)
    }
    setProgress(0)
    try {
      const stored = await sendPhoto(file, setProgress)
      await mutate({ uploads: [stored, ...(data?.uploads ?? [])] }, { revalidate: false })
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

  return (
    <div className="space-y-2 rounded border border-stone-200 bg-white/60 p-2" data-testid="theme-photo">
      <div className="flex items-center justify-between gap-2">
        <h3 className="text-xs font-semibold text-stone-600">Theme fabric photo</h3>
        <button type="button" className={`${button} shrink-0 whitespace-nowrap`} disabled={progress !== null} onClick={() => input.current?.click()}>
          {photo ? 'Another photo' : 'Upload a photo'}
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
      {photo ? (
        <div className="flex gap-2">
          {/* eslint-disable-next-line @next/next/no-img-element -- a private upload served by the API to its owner, not a file to optimise */}
          <img src={photo.url} alt="Theme fabric" width={photo.width} height={photo.height} className="h-auto w-24 shrink-0 rounded border border-stone-300 object-cover" />
          <ul className="grid flex-1 grid-cols-4 content-start gap-1" aria-label="Colours of the theme fabric">
            {(photo.palette ?? []).map((colour) => (
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
        progress === null && <p className="text-[11px] text-stone-500">A photo of the fabric a colourway starts from proposes its colours.</p>
      )}
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
