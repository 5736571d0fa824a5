/**
 * The board's client of the pattern API (`/api/patterns/:id`), on lib/api-client.ts: answers are
 * parsed with the same schemas the server's answers are typed with, and every outcome the save
 * machine (./autosave.ts) acts on is a plain value, never an exception.
 */
import { z } from 'zod'
import { ApiError, apiFetch } from '@/lib/api-client'
import type { DesignFile } from '@/lib/schemas/design'
import { patternViewSchema } from '@/lib/schemas/pattern'

/** The part of the pattern answer the board reads, checked with the shared schema's fields. */
const savedAnswerSchema = z.object({ pattern: patternViewSchema.pick({ revision: true, design: true }) })
const revisionAnswerSchema = z.object({ pattern: patternViewSchema.pick({ revision: true }) })

export type SaveOutcome =
  | { readonly kind: 'saved'; readonly revision: number }
  /** Saved elsewhere since `revision`: nothing was written. */
  | { readonly kind: 'conflict'; readonly currentRevision: number | null }
  /** The server refused this design; sending it again would be refused again. */
  | { readonly kind: 'invalid'; readonly message: string }
  /** Not saved for a reason that may pass (network, server, signed out): worth retrying. */
  | { readonly kind: 'failed'; readonly message: string }

export interface SavedPattern {
  readonly revision: number
  readonly design: DesignFile
}

export interface PatternApi {
  /** Saves `design` as the change from `revision`; `keepalive` lets the request outlive the page. */
  save(revision: number, design: DesignFile, options?: { keepalive?: boolean }): Promise<SaveOutcome>
  /** The pattern as saved now; throws an Error with a plain-words message when it cannot be read. */
  load(): Promise<SavedPattern>
}

export const UNREACHABLE = 'Could not reach Wreathwright.'
const SIGNED_OUT = 'You are signed out. Sign in again (in another tab) and saving carries on.'

/** A refusal or failure in plain words. */
function messageOf(error: unknown): string {
  if (!(error instanceof ApiError)) return UNREACHABLE
  return error.status === 401 ? SIGNED_OUT : error.message
}

/**
 * The pattern API of one pattern.
 *
 * @example
 * const api = createPatternApi(pattern.id)
 * const outcome = await api.save(pattern.revision, design) // { kind: 'saved', revision: 4 }
 */
export function createPatternApi(patternId: string, fetch?: typeof globalThis.fetch): PatternApi {
  const url = `/api/patterns/${encodeURIComponent(patternId)}`
  return {
    async save(revision, design, { keepalive = false } = {}) {
      try {
        const { pattern } = await apiFetch(url, { method: 'PATCH', json: { revision, design }, keepalive, schema: revisionAnswerSchema, fetch })
        return { kind: 'saved', revision: pattern.revision }
      } catch (error) {
        if (error instanceof ApiError && error.status === 409) {
          const current = error.body.currentRevision
          return { kind: 'conflict', currentRevision: typeof current === 'number' ? current : null }
        }
        if (error instanceof ApiError && error.status === 422) {
          const first = error.issues[0]
          const detail = first ? `${first.path}: ${first.message}` : error.message
          return { kind: 'invalid', message: `The server refused this design (${detail}).` }
        }
        return { kind: 'failed', message: messageOf(error) }
      }
    },
    async load() {
      try {
        const { pattern } = await apiFetch(url, { schema: savedAnswerSchema, fetch })
        return { revision: pattern.revision, design: pattern.design }
      } catch (error) {
        throw new Error(error instanceof ApiError && error.status < 300 ? 'The saved pattern could not be read.' : messageOf(error), { cause: error })
      }
    },
  }
}
