import { BODY_LIMITS, route } from '@/lib/http'
import { listingSettingsSchema } from '@/lib/schemas/listing-settings'
import { authorizePatternAction } from '@/lib/services/patterns'
import { getListingSettings, setListingSettings } from '@/lib/services/shop-listings'

/**
 * The pattern's listing settings in the shop, for its designer and admins (404 to those who may
 * not see the pattern, 403 to those who see it but may not change it):
 * `GET /api/patterns/:id/listing` → `{ listing: { skillNotes, cover } }`, and
 * `PATCH /api/patterns/:id/listing { skillNotes?, coverUploadId? }` → the same, changed. The cover
 * is uploaded first (`POST /api/uploads?kind=cover`), then named here; `coverUploadId: null` takes
 * it off.
 */
export const GET = route(
  { params: ['id'], bodyLimit: BODY_LIMITS.none, session: 'required', permit: ({ user, params }) => authorizePatternAction(user, params.id, 'update-pattern') },
  async ({ user, params }) => Response.json({ listing: await getListingSettings(user, params.id) }),
)

export const PATCH = route(
  {
    params: ['id'],
    bodyLimit: BODY_LIMITS.form,
    session: 'required',
    permit: ({ user, params }) => authorizePatternAction(user, params.id, 'update-pattern'),
    body: listingSettingsSchema,
  },
  async ({ user, params, body }) => Response.json({ listing: await setListingSettings(user, params.id, body) }),
)
