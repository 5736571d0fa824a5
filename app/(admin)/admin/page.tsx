import { redirect } from 'next/navigation'
import { requireAdmin } from '../admin-guard'

/** /admin opens the desk at its users table. */
export default async function AdminDeskPage() {
  await requireAdmin('manage-users')
  redirect('/admin/users')
}
