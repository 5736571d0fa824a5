import { requestAddress } from '@/lib/client-address'
import { BODY_LIMITS, route } from '@/lib/http'
import { accountDeletionSchema, displayNameChangeSchema } from '@/lib/schemas/account'
import { changeDisplayName, deleteAccount, getAccountOverview } from '@/lib/services/account-settings'

/** The signed-in person's account: name, address, roles, sessions. */
export const GET = route({ bodyLimit: BODY_LIMITS.none, session: 'required' }, async ({ user, sessionId }) =>
  Response.json({ account: await getAccountOverview(user, sessionId) }),
)

export const PATCH = route({ bodyLimit: BODY_LIMITS.form, session: 'required', body: displayNameChangeSchema }, async ({ user, body }) =>
  Response.json(await changeDisplayName(user, body.displayName)),
)

/** Deletes the account; needs the current password and `confirm: "DELETE"`. */
export const DELETE = route({ bodyLimit: BODY_LIMITS.form, session: 'required', body: accountDeletionSchema }, async ({ request, user, body }) => {
  const { clearedCookie } = await deleteAccount(user, body.currentPassword, { clientAddress: requestAddress(request) })
  return Response.json({ deleted: true }, { headers: { 'set-cookie': clearedCookie } })
})
