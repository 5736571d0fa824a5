import { BODY_LIMITS, route } from '@/lib/http'
import { reportMessageSchema } from '@/lib/schemas/report'
import { answerReport, beginReportMessage } from '@/lib/services/reports'

/** `{ text }`: an answer in the report's thread, by the designer, a tester or an admin; 201 with the report. */
export const POST = route(
  { params: ['id'], bodyLimit: BODY_LIMITS.form, session: 'required', permit: ({ user, params }) => beginReportMessage(user, params.id), body: reportMessageSchema },
  async ({ user, params, body }) => Response.json({ report: await answerReport(user, params.id, body.text) }, { status: 201 }),
)
