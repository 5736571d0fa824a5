import type { Metadata } from 'next'
import Link from 'next/link'
import { notFound } from 'next/navigation'
import { PrintDialog } from '@/components/print/print-dialog'
import { UnreadableDesign } from '@/components/patterns/unreadable-design'
import { requireUser } from '@/lib/auth/current-user'
import { NotFoundError, StoredDesignError } from '@/lib/errors'
import { getLicensedPattern } from '@/lib/services/licences'

export const metadata: Metadata = { title: 'Print room' }

/** The licence holder's print room: the booklet built in the browser from the pattern's design. */
export default async function LicencePrintPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params
  const user = await requireUser(undefined, `/library/${id}/print`)
  let licensed
  try {
    licensed = await getLicensedPattern(user, id)
  } catch (error) {
    if (error instanceof StoredDesignError) return <UnreadableDesign error={error} />
    if (error instanceof NotFoundError) notFound()
    throw error
  }
  const { licence, pattern } = licensed
  return (
    <article className="mx-auto max-w-6xl space-y-6">
      <Link href="/library" className="text-sm text-thread-700 hover:underline">
        ← My library
      </Link>
      <h1 className="text-2xl font-semibold text-thread-800">Print room: {pattern.name}</h1>
      <p className="max-w-xl text-sm text-stone-600">
        Licence {licence.number}. Print it at your size on your paper, in any colourway, as often as you need.
      </p>
      <PrintDialog name={pattern.name} design={pattern.design} />
    </article>
  )
}
