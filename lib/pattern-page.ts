import 'server-only'
import { notFound } from 'next/navigation'
import { NotFoundError, StoredDesignError } from '@/lib/errors'

/**
 * What a pattern's pages (overview, board, fabric, print room) load, as those pages answer it: a
 * pattern the person may not see is the not-found page, exactly like a missing one; a stored design
 * that no longer reads comes back as its error, for the page to show (`UnreadableDesign`) instead
 * of failing.
 *
 * @example const pattern = await loadForPatternPage(getPattern(user, id))
 */
export async function loadForPatternPage<T>(loading: Promise<T>): Promise<T | StoredDesignError> {
  return loading.catch((error: unknown) => {
    if (error instanceof NotFoundError) notFound()
    if (error instanceof StoredDesignError) return error
    throw error
  })
}
