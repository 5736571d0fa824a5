import type { Metadata } from 'next'
import { notFound } from 'next/navigation'
import { ProjectRoom } from '@/components/sewing-room/project-room'
import { requireUser } from '@/lib/auth/current-user'
import { NotFoundError } from '@/lib/errors'
import { loadProject } from '@/lib/services/sewing-room'

export const metadata: Metadata = { title: 'Sewing room' }

/**
 * One project: the next step, the ring so far and the checklist (components/sewing-room/project-room.tsx).
 * Someone else's project, or one whose licence or invitation has ended, is the not-found page, as
 * the API answers it.
 */
export default async function ProjectPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params
  const user = await requireUser(undefined, `/sewing-room/${id}`)
  await loadProject(user, id, 'sewing-room:read').catch((error: unknown) => {
    if (error instanceof NotFoundError) notFound()
    throw error
  })
  return <ProjectRoom projectId={id} />
}
