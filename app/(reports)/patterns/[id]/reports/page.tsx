import type { Metadata } from 'next'
import { notFound } from 'next/navigation'
import { ReportsPage } from '@/components/reports/reports-page'
import { requireUser } from '@/lib/auth/current-user'
import { NotFoundError } from '@/lib/errors'
import { reportPlaces } from '@/lib/services/reports'

export const metadata: Metadata = { title: 'Test reports' }

/**
 * A pattern's test reports, for its designer, its testers and admins (outside the studio's
 * layout: testers need no designer account). Others get the not-found page.
 */
export default async function PatternReportsPage({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Promise<{ report?: string }> }) {
  const { id } = await params
  const { report } = await searchParams
  // Strangers sign in and come back to the page asked for, with its ?report= (proxy.ts passes the path on).
  const user = await requireUser()
  const places = await reportPlaces(user, id).catch((error: unknown) => {
    if (error instanceof NotFoundError) notFound()
    throw error
  })
  return (
    <div className="mx-auto max-w-6xl">
      <ReportsPage
        patternId={id}
        patternName={places.patternName}
        areas={places.areas}
        map={places.map}
        canFile={places.canFile}
        canChangeState={places.canChangeState}
        initialReportId={typeof report === 'string' ? report : null}
      />
    </div>
  )
}
