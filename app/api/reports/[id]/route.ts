import { BODY_LIMITS, route } from '@/lib/http'
import { updateReportSchema } from '@/lib/schemas/report'
import { authorizeReportRead, authorizeReportStateChange, changeReportState, getReport } from '@/lib/services/reports'

/** One report with its thread: to the pattern's designer, its testers and admins; 404 to others. */
export const GET = route(
  { params: ['id'], bodyLimit: BODY_LIMITS.none, session: 'required', permit: ({ user, params }) => authorizeReportRead(user, params.id) },
  async ({ user, params }) => Response.json({ report: await getReport(user, params.id) }),
)

/** `{ state: 'open' | 'resolved' }`: the pattern's designer or an admin resolves or reopens a report (testers 403). */
export const PATCH = route(
  { params: ['id'], bodyLimit: BODY_LIMITS.form, session: 'required', permit: ({ user, params }) => authorizeReportStateChange(user, params.id), body: updateReportSchema },
  async ({ user, params, body }) => Response.json({ report: await changeReportState(user, params.id, body.state) }),
)
