import 'server-only'
import type { Metadata } from 'next'
import { notFound } from 'next/navigation'
import { getCurrentUser, requireUser } from '@/lib/auth/current-user'
import { can, type Action } from '@/lib/authorization'
import type { CurrentUser } from '@/lib/auth/session'

type DeskAction = Extract<Action, 'manage-users' | 'decide-designer-requests' | 'read-audit-log' | 'read-mail-log' | 'read-payment-log'>

/**
 * For the admin desk's layout and each of its pages (Next.js renders a page alongside its layout,
 * so each checks for itself): strangers go to sign in and back; anyone else who may not take
 * `action` gets the not-found page, so the desk's addresses give nothing away.
 */
export async function requireAdmin(action: DeskAction): Promise<CurrentUser> {
  const user = await requireUser()
  if (!can(user, action)) notFound()
  return user
}

/**
 * A desk page's title, for admins only: Next.js resolves a page's metadata even when its layout
 * answers not-found, and a title such as "Audit log" would tell others the page exists.
 */
export async function deskTitle(title: string): Promise<Metadata> {
  return can(await getCurrentUser(), 'manage-users') ? { title: `${title} · Admin desk` } : {}
}
