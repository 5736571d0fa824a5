import type { ReactNode } from 'react'
import { AdminNav } from '@/components/admin/admin-nav'
import { requireAdmin } from './admin-guard'

/** The admin desk: only admins get past this layout; others see the not-found page, strangers the sign-in page. */
export default async function AdminLayout({ children }: { children: ReactNode }) {
  await requireAdmin('manage-users')
  return (
    <div className="mx-auto max-w-6xl space-y-6">
      <AdminNav />
      {children}
    </div>
  )
}
