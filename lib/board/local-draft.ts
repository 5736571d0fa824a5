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
  let text: string | null
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

/**
 * The local-draft rules of one board (one autosaver):
 * - every unsaved change is kept, and cleared once the server has it;
 * - one tab never clears a draft another tab wrote (`writer`);
 * - a draft an earlier visit left is offered back (`recoverable`) and, until the designer answers,
 *   stays in storage untouched: the current work goes to the server anyway, and the old one must
 *   survive another crash.
 */
export interface LocalDrafts {
  /** A draft left by an earlier visit that differs from the saved design, until restored or discarded. */
  readonly recoverable: LocalDraft | null
  /** Looks once, before this board writes a draft of its own over it. */
  lookForRecoverable(savedDesign: DesignFile): void
  /** Keeps an unsaved design, made from `baseRevision`. */
  keep(design: DesignFile, baseRevision: number): void
  /** The server has the design: the draft goes. */
  drop(): void
  /** Hands the recoverable draft over (to put on the board) and forgets it. */
  takeRecoverable(): LocalDraft | null
  /** Forgets the recoverable draft; the board's own unsaved design, if any, is kept in its place. */
  discardRecoverable(unsaved: { design: DesignFile; baseRevision: number } | null): void
}

/**
 * The drafts of one board of a pattern. `storage` null keeps none (server rendering, storage off).
 *
 * @example
 * const drafts = createLocalDrafts(localStorage, pattern.id)
 * drafts.lookForRecoverable(pattern.design)
 * if (drafts.recoverable) offerBack(drafts.recoverable)
 */
export function createLocalDrafts(storage: DraftStorage | null, patternId: string): LocalDrafts {
  // Not crypto.randomUUID: that exists only on secure origins, and a board may be opened over plain http on a LAN.
  const writer = Math.random().toString(36).slice(2, 12)
  let recoverable: LocalDraft | null = null
  let looked = false
  const keep = (design: DesignFile, baseRevision: number) => {
    if (recoverable) return
    writeLocalDraft(storage, { patternId, baseRevision, savedAt: new Date().toISOString(), design, writer })
  }
  return {
    get recoverable() {
      return recoverable
    },
    lookForRecoverable(savedDesign) {
      if (looked) return
      looked = true
      recoverable = findRecoverableDraft(storage, patternId, savedDesign)
      if (!recoverable) clearLocalDraft(storage, patternId)
    },
    keep,
    drop() {
      if (!recoverable) clearLocalDraft(storage, patternId, writer)
    },
    takeRecoverable() {
      const draft = recoverable
      recoverable = null
      return draft
    },
    discardRecoverable(unsaved) {
      if (!recoverable) return
      recoverable = null
      // The stored draft is still the one offered (nothing was written over it meanwhile), so it
      // goes whoever wrote it.
      if (unsaved) keep(unsaved.design, unsaved.baseRevision)
      else clearLocalDraft(storage, patternId)
    },
  }
}
