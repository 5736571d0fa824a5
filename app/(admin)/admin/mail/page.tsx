import type { Metadata } from 'next'
import { Pager } from '@/components/admin/pager'
import { pageNumber } from '@/components/admin/page-number'
import { listOutgoingMail } from '@/lib/services/admin'
import { deskTitle, requireAdmin } from '../../admin-guard'

export const generateMetadata = (): Promise<Metadata> => deskTitle('Mail log')

/** The outgoing mail: to whom, what kind, where it stands. The messages themselves are not shown (their links may be secrets). */
export default async function MailLogPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const admin = await requireAdmin('read-mail-log')
  const mail = await listOutgoingMail(admin, { page: pageNumber(await searchParams) })
  return (
    <section className="space-y-4">
      <h1 className="text-2xl font-semibold text-thread-800">Mail log</h1>
      <p className="max-w-3xl text-stone-700">
        Every message Wreathwright queued, newest first: to whom, what kind, and whether it went out. The messages themselves are not kept
        here.{' '}
        {mail.mailViewUrl ? (
          <>
            Where mail goes to the local mail catcher, read them in{' '}
            <a href={mail.mailViewUrl} target="_blank" rel="noreferrer" className="text-thread-700 underline">
              the mail catcher’s inbox
            </a>
            .
          </>
        ) : (
          'No mail catcher is set up here (MAIL_VIEW_URL).'
        )}
      </p>
      {mail.rows.length === 0 ? (
        <p className="text-stone-600">No mail yet.</p>
      ) : (
        <table className="w-full border-collapse text-sm">
          <thead className="border-b border-linen-200 text-left text-stone-600">
            <tr>
              <th scope="col" className="px-2 py-2">Queued</th>
              <th scope="col" className="px-2 py-2">To</th>
              <th scope="col" className="px-2 py-2">Kind</th>
              <th scope="col" className="px-2 py-2">State</th>
              <th scope="col" className="px-2 py-2">Tries</th>
              <th scope="col" className="px-2 py-2">Sent</th>
            </tr>
          </thead>
          <tbody>
            {mail.rows.map((row) => (
              <tr key={row.id} className="border-b border-linen-100 align-top" data-testid="mail-row">
                <td className="px-2 py-2 whitespace-nowrap">{row.queuedAt.slice(0, 16).replace('T', ' ')} UTC</td>
                <td className="px-2 py-2">{row.to}</td>
                <td className="px-2 py-2">{row.kind}</td>
                <td className="px-2 py-2" title={row.lastError ?? undefined}>
                  {row.state}
                  {row.lastError && <span className="block text-xs text-madder-700">{row.lastError.slice(0, 160)}</span>}
                </td>
                <td className="px-2 py-2">{row.attempts}</td>
                <td className="px-2 py-2 whitespace-nowrap">{row.sentAt ? `${row.sentAt.slice(0, 16).replace('T', ' ')} UTC` : '—'}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      <Pager page={mail.page} pageCount={mail.pageCount} total={mail.total} noun="messages" hrefFor={(page) => `/admin/mail?page=${page}`} />
    </section>
  )
}
