import type { Metadata } from 'next'
import Link from 'next/link'
import { redirect } from 'next/navigation'
import { PrintDialog } from '@/components/print/print-dialog'
import { UnreadableDesign } from '@/components/patterns/unreadable-design'
import { requireUser } from '@/lib/auth/current-user'
import { StoredDesignError } from '@/lib/errors'
import { loadForPatternPage } from '@/lib/pattern-page'
import { getPatternForPrint } from '@/lib/services/patterns'

export const metadata: Metadata = { title: 'Pattern to test' }

/**
 * A pattern as its tester sees it: what it is, and its print room, free, in any colourway, size
 * and paper; every page of the booklet says it is their test copy. Anyone else: not found.
 */
export default async function PatternToTestPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params
  const user = await requireUser(undefined, `/testing/${id}`)
  const loaded = await loadForPatternPage(getPatternForPrint(user, id))
  if (loaded instanceof StoredDesignError) return <UnreadableDesign error={loaded} />
  const { pattern, footer, asTester } = loaded
  // Its designer (or an admin) works on it in the studio.
  if (!asTester) redirect(`/patterns/${pattern.id}`)
  const { ring } = pattern.design
  const colorways = pattern.design.colorways ?? []
  return (
    <article className="mx-auto max-w-6xl space-y-6">
      <Link href="/testing" className="text-sm text-thread-700 hover:underline">
        ← Patterns to test
      </Link>
      <h1 className="text-2xl font-semibold text-thread-800">{pattern.name}</h1>
      <p className="max-w-2xl text-stone-700">
        You are testing this pattern: print the booklet, sew it, and note what could be clearer. Printing is free; each page
        of your booklet is marked as your test copy.
      </p>
      <p>
        <Link href={`/patterns/${pattern.id}/reports`} className="rounded bg-thread-700 px-4 py-2 text-white hover:bg-thread-800">
          Report a problem
        </Link>
        <Link href={`/sewing-room/new?testing=${pattern.id}`} className="ml-3 rounded border border-thread-700 px-4 py-2 text-thread-700 hover:bg-linen-100">
          Sew it in the sewing room
        </Link>
      </p>
      <dl className="grid max-w-xl grid-cols-2 gap-x-6 gap-y-2 text-sm">
        <dt className="text-stone-500">Finished diameter</dt>
        <dd>
          {2 * ring.outerRadius} {pattern.design.units}
        </dd>
        <dt className="text-stone-500">Repeats</dt>
        <dd>{ring.repeats}</dd>
        <dt className="text-stone-500">Colourways</dt>
        <dd>{colorways.map((colorway) => colorway.name).join(', ') || 'none'}</dd>
        <dt className="text-stone-500">Revision</dt>
        <dd>{pattern.revision}</dd>
      </dl>
      <section id="print" aria-labelledby="print-heading" className="space-y-3 rounded-lg border border-linen-200 bg-white p-6">
        <h2 id="print-heading" className="text-lg font-semibold">
          Print your test copy
        </h2>
        <PrintDialog name={pattern.name} design={pattern.design} footer={footer ?? undefined} />
      </section>
    </article>
  )
}
