/**
 * Sending an image to the upload route from the board: a theme-fabric photo or a swatch. The
 * server sniffs, checks and remakes it (app/api/uploads/route.ts); this side only saves the wait
 * for a file that is plainly too large, and reports how much has been sent.
 */
import type { z } from 'zod'
import { uploadAnswerSchema, type UploadView, type uploadPurposeSchema } from '@/lib/schemas/upload'

type UploadPurpose = z.infer<typeof uploadPurposeSchema>

/** The largest image the server accepts (lib/images.ts MAX_UPLOAD_BYTES), checked here first to save the wait. */
const MAX_IMAGE_BYTES = 10 * 1024 * 1024

/**
 * Why a file will be refused for its size, in plain words; null when it is small enough.
 *
 * @example tooLarge(12 * 1024 * 1024, 'photo') // 'The photo is 12.0 MB; at most 10 MB is accepted. Use a smaller photo.'
 */
export function tooLarge(bytes: number, what: string): string | null {
  return bytes > MAX_IMAGE_BYTES ? `The ${what} is ${(bytes / 1024 / 1024).toFixed(1)} MB; at most 10 MB is accepted. Use a smaller ${what}.` : null
}

/**
 * Sends the image as the request body, reporting the share sent so far (fetch cannot report an
 * upload's progress; XMLHttpRequest can). Resolves to the stored upload (a theme-fabric photo
 * with its palette); rejects with the server's message, in plain words.
 */
export function sendImage(file: File, kind: UploadPurpose, what: string, onProgress: (share: number) => void = () => {}): Promise<UploadView> {
  return new Promise((resolve, reject) => {
    const request = new XMLHttpRequest()
    request.open('POST', `/api/uploads?kind=${kind}`)
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
    request.onerror = () => reject(new Error(`The ${what} did not reach the server. Check the connection and try again.`))
    request.send(file)
  })
}
