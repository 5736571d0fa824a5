import type { Metadata } from 'next'
import { notFound } from 'next/navigation'
import { DraftingBoardLoader } from '@/components/board/drafting-board-loader'
import { requireUser } from '@/lib/auth/current-user'
import { UnreadableDesign } from '@/components/patterns/unreadable-design'
import { NotFoundError, StoredDesignError } from '@/lib/errors'
import { getPattern } from '@/lib/services/patterns'

export const metadata: Metadata = { title: 'Drafting board' }

export default async function DraftingBoardPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params
  const user = await requireUser(undefined, `/patterns/${id}/board`)
  const pattern = await getPattern(user, id).catch((error: unknown) => {
    if (error instanceof NotFoundError) notFound()
    if (error instanceof StoredDesignError) return error
    throw error
  })
  if (pattern instanceof StoredDesignError) return <UnreadableDesign error={pattern} />
  return <DraftingBoardLoader patternId={pattern.id} patternName={pattern.name} revision={pattern.revision} design={pattern.design} />
}
