import Link from 'next/link'
import type { StoredDesignError } from '@/lib/errors'

/**
 * What a pattern page shows instead of crashing when the pattern's stored design no longer reads
 * as a design: which pattern, which fields, and that nothing was changed.
 *
 * @example if (loaded instanceof StoredDesignError) return <UnreadableDesign error={loaded} />
 */
export function UnreadableDesign({ error }: { error: StoredDesignError }) {
  const { patternId, patternName, issues } = error.details
  return (
    <article role="alert" className="mx-auto max-w-3xl space-y-4" data-testid="unreadable-design">
      <Link href="/patterns" className="text-sm text-thread-700 hover:underline">
        ← Pattern shelf
      </Link>
      <h1 className="text-2xl font-semibold text-thread-800">{patternName}: the saved design cannot be read</h1>
      <p className="text-sm text-stone-700">{error.message}</p>
      <ul className="list-disc pl-5 text-sm text-stone-700">
        {issues.map((issue) => (
          <li key={`${issue.path}:${issue.message}`}>
            <code>design.{issue.path}</code>: {issue.message}
          </li>
        ))}
      </ul>
      <p className="text-xs text-stone-500">Pattern id: {patternId}</p>
    </article>
  )
}
