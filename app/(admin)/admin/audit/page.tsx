import type { Metadata } from 'next'
import { auditWords } from '@/components/admin/audit-words'
import { Pager } from '@/components/admin/pager'
import { pageNumber } from '@/components/admin/page-number'
import { listAuditEntries } from '@/lib/services/admin'
import { deskTitle, requireAdmin } from '../../admin-guard'

export const generateMetadata = (): Promise<Metadata> => deskTitle('Audit log')

/** Every admin action, newest first. Nobody can change or remove an entry: the database refuses it. */
export default async function AuditLogPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const admin = await requireAdmin('read-audit-log')
  const entries = await listAuditEntries(admin, { page: pageNumber(await searchParams) })
  return (
    <section className="space-y-4">
      <h1 className="text-2xl font-semibold text-thread-800">Audit log</h1>
      <p className="max-w-3xl text-stone-700">Every change made from this desk: who, what, to whom, when. Entries cannot be changed or removed.</p>
      {entries.rows.length === 0 ? (
        <p className="text-stone-600">No admin has changed anything yet.</p>
      ) : (
        <table className="w-full border-collapse text-sm">
          <thead className="border-b border-linen-200 text-left text-stone-600">
            <tr>
              <th scope="col" className="px-2 py-2">When (UTC)</th>
              <th scope="col" className="px-2 py-2">Who</th>
              <th scope="col" className="px-2 py-2">What</th>
              <th scope="col" className="px-2 py-2">Whom</th>
            </tr>
          </thead>
          <tbody>
            {entries.rows.map((entry) => (
              <tr key={entry.id} className="border-b border-linen-100 align-top" data-testid="audit-row">
                <td className="px-2 py-2 whitespace-nowrap">{entry.at.slice(0, 19).replace('T', ' ')}</td>
                <td className="px-2 py-2">{entry.actor}</td>
                <td className="px-2 py-2">{auditWords(entry.action, entry.details)}</td>
                <td className="px-2 py-2">{entry.target ?? '—'}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      <Pager page={entries.page} pageCount={entries.pageCount} total={entries.total} noun="entries" hrefFor={(page) => `/admin/audit?page=${page}`} />
    </section>
  )
}
