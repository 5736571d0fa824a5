import type { ReactNode } from 'react'
import { requireUser } from '@/lib/auth/current-user'

/** Designer screens: only designers (and admins) get past this layout. */
export default async function StudioLayout({ children }: { children: ReactNode }) {
  await requireUser('list-own-patterns', '/patterns')
  return <div className="space-y-6">{children}</div>
}
