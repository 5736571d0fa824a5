import type { AdminUserRow } from '@/lib/schemas/admin'

/** Small labels for what stands out about an account: disabled, unverified, asking to design. */
export function UserState({ user }: { user: AdminUserRow }) {
  const label = 'rounded px-1.5 py-0.5 text-xs'
  return (
    <span className="flex flex-wrap gap-1">
      {user.disabledAt && <span className={`${label} border border-madder-600 text-madder-700`}>disabled</span>}
      {!user.emailVerified && <span className={`${label} bg-linen-200 text-stone-700`}>unverified</span>}
      {user.designerRequestedAt && <span className={`${label} border border-thread-600 text-thread-800`}>asks to design</span>}
    </span>
  )
}
