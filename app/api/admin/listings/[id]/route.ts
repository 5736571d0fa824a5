import { authorize } from '@/lib/authorization'
import { BODY_LIMITS, route } from '@/lib/http'
import { listingVisibilitySchema } from '@/lib/schemas/shop-listings'
import { setListingHidden } from '@/lib/services/shop-listings'

/** `PATCH /api/admin/listings/:id { hidden }` → `{ id, hidden }`: take a listing out of the shop, or put it back (admins). */
export const PATCH = route(
  { params: ['id'], bodyLimit: BODY_LIMITS.form, session: 'required', permit: ({ user }) => authorize(user, 'hide-listing'), body: listingVisibilitySchema },
  async ({ user, params, body }) => Response.json(await setListingHidden(user, params.id, body.hidden)),
)
