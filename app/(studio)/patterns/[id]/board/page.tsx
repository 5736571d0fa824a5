import type { Metadata } from 'next'
import { DraftingBoardLoader } from '@/components/board/drafting-board-loader'
import { requireUser } from '@/lib/auth/current-user'
import { UnreadableDesign } from '@/components/patterns/unreadable-design'
import { StoredDesignError } from '@/lib/errors'
import { loadForPatternPage } from '@/lib/pattern-page'
import { getPattern } from '@/lib/services/patterns'

export const metadata: Metadata = { title: 'Drafting board' }

export default async function DraftingBoardPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params
  const user = await requireUser(undefined, `/patterns/${id}/board`)
  const pattern = await loadForPatternPage(getPattern(user, id))
  if (pattern instanceof StoredDesignError) return <UnreadableDesign error={pattern} />
  return <DraftingBoardLoader patternId={pattern.id} patternName={pattern.name} revision={pattern.revision} design={pattern.design} />
}
