import type { Metadata } from 'next'
import { Pager } from '@/components/admin/pager'
import { pageNumber } from '@/components/admin/page-number'
import { RequestDecision } from '@/components/admin/request-decision'
import { UserState } from '@/components/admin/user-state'
import { listDesignerRequests } from '@/lib/services/admin'
import { deskTitle, requireAdmin } from '../../admin-guard'

export const generateMetadata = (): Promise<Metadata> => deskTitle('Designer requests')

export default async function DesignerRequestsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const admin = await requireAdmin('decide-designer-requests')
  const requests = await listDesignerRequests(admin, { page: pageNumber(await searchParams) })
  return (
    <section className="space-y-4">
      <h1 className="text-2xl font-semibold text-thread-800">Designer requests</h1>
      <p className="max-w-3xl text-stone-700">
        People who asked for a designer account when they signed up. Approving gives them the designer role; either way they get an
        e-mail, and the decision goes into the audit log.
      </p>
      {requests.rows.length === 0 ? (
        <p className="text-stone-600">No requests are waiting.</p>
      ) : (
        <table className="w-full border-collapse text-sm">
          <thead className="border-b border-linen-200 text-left text-stone-600">
            <tr>
              <th scope="col" className="px-2 py-2">Name</th>
              <th scope="col" className="px-2 py-2">E-mail</th>
              <th scope="col" className="px-2 py-2">Asked on</th>
              <th scope="col" className="px-2 py-2">State</th>
              <th scope="col" className="px-2 py-2">Decision</th>
            </tr>
          </thead>
          <tbody>
            {requests.rows.map((user) => (
              <tr key={user.id} className="border-b border-linen-100 align-top" data-testid="request-row">
                <td className="px-2 py-2 font-medium">{user.displayName}</td>
                <td className="px-2 py-2">{user.email}</td>
                <td className="px-2 py-2 whitespace-nowrap">{user.designerRequestedAt?.slice(0, 10)}</td>
                <td className="px-2 py-2">
                  <UserState user={{ ...user, designerRequestedAt: null }} />
                </td>
                <td className="px-2 py-2">
                  <RequestDecision userId={user.id} displayName={user.displayName} />
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      <Pager page={requests.page} pageCount={requests.pageCount} total={requests.total} noun="requests" hrefFor={(page) => `/admin/requests?page=${page}`} />
    </section>
  )
}
