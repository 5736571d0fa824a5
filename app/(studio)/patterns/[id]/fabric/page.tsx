import type { Metadata } from 'next'
import Link from 'next/link'
import { FabricScreen } from '@/components/fabric/fabric-screen'
import { UnreadableDesign } from '@/components/patterns/unreadable-design'
import { requireUser } from '@/lib/auth/current-user'
import { StoredDesignError } from '@/lib/errors'
import { loadForPatternPage } from '@/lib/pattern-page'
import { getPattern } from '@/lib/services/patterns'

export const metadata: Metadata = { title: 'Fabric and cutting' }

/** What to buy and how to cut it, per colourway: computed in the browser from the saved design, as the print room does. */
export default async function FabricPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params
  const user = await requireUser(undefined, `/patterns/${id}/fabric`)
  const pattern = await loadForPatternPage(getPattern(user, id))
  if (pattern instanceof StoredDesignError) return <UnreadableDesign error={pattern} />
  return (
    <article className="mx-auto max-w-6xl space-y-6">
      <Link href={`/patterns/${pattern.id}`} className="text-sm text-thread-700 hover:underline print:hidden">
        ← {pattern.name}
      </Link>
      <h1 className="text-2xl font-semibold text-thread-800">Fabric and cutting: {pattern.name}</h1>
      <p className="max-w-2xl text-sm text-stone-600">
        What to buy for each colourway and how to cut it, from revision {pattern.revision}: the fabric table, the leaves to
        prepare, the bias strips and a cutting diagram for every fabric.
      </p>
      <FabricScreen name={pattern.name} design={pattern.design} />
    </article>
  )
}
