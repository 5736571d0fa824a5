import type { ReactNode } from 'react'
import { requireUser } from '@/lib/auth/current-user'

/** Designer screens: only designers (and admins) get past this layout. The board uses the full width; other pages narrow themselves. */
export default async function StudioLayout({ children }: { children: ReactNode }) {
  await requireUser('list-own-patterns', '/patterns')
  return <>{children}</>
}
