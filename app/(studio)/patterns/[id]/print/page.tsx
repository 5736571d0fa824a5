import type { Metadata } from 'next'
import Link from 'next/link'
import { PrintDialog } from '@/components/print/print-dialog'
import { requireUser } from '@/lib/auth/current-user'
import { UnreadableDesign } from '@/components/patterns/unreadable-design'
import { StoredDesignError } from '@/lib/errors'
import { loadForPatternPage } from '@/lib/pattern-page'
import { getPatternForPrint } from '@/lib/services/patterns'

export const metadata: Metadata = { title: 'Print room' }

/** The print room of one pattern: the booklet is built in the browser from the saved design. */
export default async function PrintPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params
  const user = await requireUser(undefined, `/patterns/${id}/print`)
  const loaded = await loadForPatternPage(getPatternForPrint(user, id))
  if (loaded instanceof StoredDesignError) return <UnreadableDesign error={loaded} />
  const { pattern, footer } = loaded
  return (
    <article className="mx-auto max-w-6xl space-y-6">
      <Link href={`/patterns/${pattern.id}`} className="text-sm text-thread-700 hover:underline">
        ← {pattern.name}
      </Link>
      <h1 className="text-2xl font-semibold text-thread-800">Print room: {pattern.name}</h1>
      <p className="max-w-xl text-sm text-stone-600">
        One PDF booklet: cover, cutting list, sewing steps, the foundations mirrored at exact scale and tiled across
        your paper, templates and a placement guide. Revision {pattern.revision}.
      </p>
      <PrintDialog name={pattern.name} design={pattern.design} footer={footer ?? undefined} />
    </article>
  )
}
