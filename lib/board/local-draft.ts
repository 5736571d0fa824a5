/**
 * The board's local drafts: every change is kept in the browser (localStorage) until it is saved,
 * so closing the tab or a crash loses nothing; a draft left from an earlier visit is offered back.
 */
import type { DesignFile } from '@/lib/schemas/design'
import { designFileSchema } from '@/lib/schemas/design'
import { normalizeDesign } from './commands'

/** The part of the Web Storage API the drafts use (window.localStorage in the browser). */
export type DraftStorage = Pick<Storage, 'getItem' | 'setItem' | 'removeItem'>


/** A design the board had not yet saved, as kept in localStorage. */
export interface LocalDraft {
  readonly patternId: string
  /** The revision the changes started from. */
  readonly baseRevision: number
  /** When the draft was written (ISO time). */
  readonly savedAt: string
  readonly design: DesignFile
  /** Which board wrote it (a random id per autosaver), so one tab never clears another's draft. */
  readonly writer?: string
}

/** The localStorage key of a pattern's draft, e.g. `wreathwright:draft:4f0c…`. */
export const draftKey = (patternId: string) => `wreathwright:draft:${patternId}`

/**
 * Reads a pattern's draft; anything unreadable or not a valid design counts as no draft, so a
 * damaged entry can never break the board.
 *
 * @example const draft = readLocalDraft(window.localStorage, pattern.id)
 */
export function readLocalDraft(storage: DraftStorage | null, patternId: string): LocalDraft | null {
  let text: string | null = null
  try {
    text = storage?.getItem(draftKey(patternId)) ?? null
  } catch {
    return null
  }
  if (!text) return null
  try {
    const value = JSON.parse(text) as Partial<LocalDraft>
    const design = designFileSchema.safeParse(value.design)
    if (!design.success || typeof value.baseRevision !== 'number' || typeof value.savedAt !== 'string') return null
    const writer = typeof value.writer === 'string' ? { writer: value.writer } : {}
    return { patternId, baseRevision: value.baseRevision, savedAt: value.savedAt, design: design.data, ...writer }
  } catch {
    return null
  }
}

/**
 * Writes a draft; false when storage refused it (full, or switched off) — saving to the server
 * goes on regardless.
 *
 * @example writeLocalDraft(localStorage, { patternId, baseRevision: 3, savedAt: new Date().toISOString(), design })
 */
export function writeLocalDraft(storage: DraftStorage | null, draft: LocalDraft): boolean {
  if (!storage) return false
  try {
    storage.setItem(draftKey(draft.patternId), JSON.stringify(draft))
    return true
  } catch {
    return false
  }
}

/**
 * Removes a pattern's draft; with `writer`, only a draft that board wrote (another tab of the same
 * pattern may hold changes of its own there).
 *
 * @example clearLocalDraft(localStorage, pattern.id)
 */
export function clearLocalDraft(storage: DraftStorage | null, patternId: string, writer?: string): void {
  if (writer !== undefined) {
    const stored = readLocalDraft(storage, patternId)
    if (stored && stored.writer !== writer) return
  }
  try {
    storage?.removeItem(draftKey(patternId))
  } catch {
    // Storage switched off: there is nothing to clear.
  }
}

/**
 * True when two designs say the same thing, whatever their key order and whether the optional
 * lists are missing or empty (the board fills them in; a file on the server may leave them out).
 *
 * @example isSameDesign(serverDesign, draft.design) // false → offer the draft back
 */
export function isSameDesign(a: DesignFile, b: DesignFile): boolean {
  return a === b || canonicalJson(normalizeDesign(a)) === canonicalJson(normalizeDesign(b))
}

/**
 * The draft worth offering back when a board opens: one exists for this pattern and says
 * something other than the saved design.
 *
 * @example
 * const draft = findRecoverableDraft(localStorage, pattern.id, pattern.design)
 * if (draft) showBanner(`Unsaved changes from ${draft.savedAt}`)
 */
export function findRecoverableDraft(storage: DraftStorage | null, patternId: string, savedDesign: DesignFile): LocalDraft | null {
  const draft = readLocalDraft(storage, patternId)
  return draft && !isSameDesign(draft.design, savedDesign) ? draft : null
}

function canonicalJson(value: unknown): string {
  return JSON.stringify(value, (_key, item: unknown) =>
    item && typeof item === 'object' && !Array.isArray(item)
      ? Object.fromEntries(Object.entries(item).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0)))
      : item,
  )
}
