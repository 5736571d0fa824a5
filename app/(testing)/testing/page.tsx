import type { Metadata } from 'next'
import Link from 'next/link'
import { requireUser } from '@/lib/auth/current-user'
import { listPatternsToTest } from '@/lib/services/invitations'

export const metadata: Metadata = { title: 'Patterns to test' }

/** A tester's list: the patterns they were invited to test and may still open. */
export default async function PatternsToTestPage() {
  const user = await requireUser(undefined, '/testing')
  const patterns = await listPatternsToTest(user)
  return (
    <section className="mx-auto max-w-3xl space-y-6">
      <h1 className="text-2xl font-semibold text-thread-800">Patterns to test</h1>
      {patterns.length === 0 ? (
        <p className="text-stone-700">
          No pattern is waiting for you. When a designer invites you to test one, it appears here once your e-mail address
          is confirmed.
        </p>
      ) : (
        <ul className="space-y-3" data-testid="patterns-to-test">
          {patterns.map((pattern) => (
            <li key={pattern.patternId} className="rounded-lg border border-linen-200 bg-white p-4">
              {pattern.open ? (
                <Link href={`/testing/${pattern.patternId}`} className="text-lg font-medium text-thread-700 hover:underline">
                  {pattern.name}
                </Link>
              ) : (
                <span className="text-lg font-medium">{pattern.name}</span>
              )}
              <p className="text-sm text-stone-600">
                {pattern.designerName ? `By ${pattern.designerName}. ` : ''}
                {pattern.open ? 'Open for testing' : 'Back with its designer for changes; it opens again when testing resumes'}
                {', '}your invitation stands until <time dateTime={pattern.expiresAt}>{new Date(pattern.expiresAt).toLocaleDateString()}</time>.
              </p>
              {pattern.open && (
                <p className="mt-2 text-sm">
                  <Link href={`/sewing-room/new?testing=${pattern.patternId}`} className="text-thread-700 hover:underline">
                    Sewing room<span className="sr-only">: start a project of {pattern.name}</span>
                  </Link>
                </p>
              )}
            </li>
          ))}
        </ul>
      )}
    </section>
  )
}
