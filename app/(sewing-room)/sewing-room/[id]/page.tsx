import type { Metadata } from 'next'
import { ProjectRoom } from '@/components/sewing-room/project-room'
import { requireUser } from '@/lib/auth/current-user'

export const metadata: Metadata = { title: 'Sewing room' }

/** One project: the next step, the ring so far and the checklist (components/sewing-room/project-room.tsx). */
export default async function ProjectPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params
  await requireUser(undefined, `/sewing-room/${id}`)
  return <ProjectRoom projectId={id} />
}
