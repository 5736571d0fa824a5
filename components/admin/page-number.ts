import { pageQuerySchema } from '@/lib/schemas/admin'

/**
 * The page number of a desk list's address; anything unreadable is page 1.
 *
 * @example pageNumber({ page: '3' }) // 3
 */
export function pageNumber(searchParams: Record<string, string | string[] | undefined>): number {
  const value = searchParams.page
  const parsed = pageQuerySchema.safeParse({ page: Array.isArray(value) ? value[0] : value })
  return parsed.success ? parsed.data.page : 1
}
