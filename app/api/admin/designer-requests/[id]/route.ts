import { authorize } from '@/lib/authorization'
import { BODY_LIMITS, route } from '@/lib/http'
import { designerRequestDecisionSchema } from '@/lib/schemas/admin'
import { decideDesignerRequest } from '@/lib/services/admin'

/** `POST /api/admin/designer-requests/:id { decision: 'approve' | 'decline' }` (:id is the account's). */
export const POST = route(
  {
    params: ['id'],
    bodyLimit: BODY_LIMITS.form,
    session: 'required',
    permit: ({ user }) => authorize(user, 'decide-designer-requests'),
    body: designerRequestDecisionSchema,
  },
  async ({ user, params, body }) => Response.json({ user: await decideDesignerRequest(user, params.id, body.decision) }),
)
