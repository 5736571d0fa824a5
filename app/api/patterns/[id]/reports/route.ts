import { ValidationError } from '@/lib/errors'
import { BODY_LIMITS, fieldIssues, route } from '@/lib/http'
import { createReportSchema, reportFilterSchema, type ReportFilter } from '@/lib/schemas/report'
import { authorizeReportsRead, beginReport, fileReport, listReports } from '@/lib/services/reports'

/** `?state=open|resolved&kind=…&tester=<id>&sort=newest|oldest`; 422 naming the parameter otherwise. */
function filterOf(request: Request): ReportFilter {
  const parsed = reportFilterSchema.safeParse(Object.fromEntries(new URL(request.url).searchParams))
  if (!parsed.success) throw new ValidationError(fieldIssues(parsed.error))
  return parsed.data
}

/** The pattern's test reports with their threads: to its designer, its testers and admins; 404 to others. */
export const GET = route(
  { params: ['id'], bodyLimit: BODY_LIMITS.none, session: 'required', permit: ({ user, params }) => authorizeReportsRead(user, params.id) },
  async ({ user, params, request }) => Response.json({ reports: await listReports(user, params.id, filterOf(request)) }),
)

/** A tester files a report: 201 with it; 403 for the designer or anyone else who reads the pattern but does not test it; 429 past the reports limit. */
export const POST = route(
  { params: ['id'], bodyLimit: BODY_LIMITS.form, session: 'required', permit: ({ user, params }) => beginReport(user, params.id), body: createReportSchema },
  async ({ user, params, body }) => Response.json({ report: await fileReport(user, params.id, body) }, { status: 201 }),
)
