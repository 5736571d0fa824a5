import type { ReactNode } from 'react'
import { requireUser } from '@/lib/auth/current-user'

/** Designer screens: only designers (and admins) get past this layout. The board uses the full width; other pages narrow themselves. */
export default async function StudioLayout({ children }: { children: ReactNode }) {
  // Strangers go to sign in and then back to the page they asked for (the path comes from proxy.ts).
  await requireUser('list-own-patterns')
  return <>{children}</>
}
