import type { PatternState } from '@/lib/schemas/pattern'
import { PATTERN_STATES } from '@/lib/schemas/pattern'

export type ShelfColumn = 'name' | 'state' | 'updatedAt'
export type SortDirection = 'ascending' | 'descending'

interface Sortable {
  readonly name: string
  readonly state: PatternState
  readonly updatedAt: string
}

/**
 * Orders shelf rows by one column. States sort in their life order (draft before testing …),
 * names by the reader's alphabet, and ties fall back to the name so the order never jumps.
 */
export function sortPatterns<T extends Sortable>(rows: readonly T[], column: ShelfColumn, direction: SortDirection): T[] {
  const collator = new Intl.Collator(undefined, { sensitivity: 'base', numeric: true })
  const compare = (a: T, b: T): number => {
    switch (column) {
      case 'name':
        return collator.compare(a.name, b.name)
      case 'state':
        return PATTERN_STATES.indexOf(a.state) - PATTERN_STATES.indexOf(b.state) || collator.compare(a.name, b.name)
      case 'updatedAt':
        return Date.parse(a.updatedAt) - Date.parse(b.updatedAt) || collator.compare(a.name, b.name)
    }
  }
  const sign = direction === 'ascending' ? 1 : -1
  return [...rows].sort((a, b) => sign * compare(a, b))
}
