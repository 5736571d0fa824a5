import { authorize } from '@/lib/authorization'
import { BODY_LIMITS, route } from '@/lib/http'
import { checkoutSchema } from '@/lib/schemas/shop'
import { startCheckout } from '@/lib/services/shop'

/** `POST /api/shop/checkout { patternId }` → `{ url, orderId }`: the payment provider's page for the pattern's own price. */
export const POST = route(
  { bodyLimit: BODY_LIMITS.form, session: 'required', permit: ({ user }) => authorize(user, 'read-own-library'), body: checkoutSchema },
  async ({ user, body }) => Response.json(await startCheckout(user, body), { status: 201 }),
)
