import type { Metadata } from 'next'
import Link from 'next/link'
import { requireUser } from '@/lib/auth/current-user'
import { listLibrary } from '@/lib/services/licences'
import { GetBooklet } from './get-booklet'

export const metadata: Metadata = { title: 'My library' }

/** The buyer's library: every pattern they hold a licence to, each with its print room. */
export default async function LibraryPage() {
  const user = await requireUser(undefined, '/library')
  const licences = await listLibrary(user)
  return (
    <article className="mx-auto max-w-4xl space-y-4">
      <h1 className="text-2xl font-semibold text-thread-800">My library</h1>
      <p className="max-w-2xl text-stone-700">
        The patterns you bought. Each licence is yours personally: every colourway, any size, on your own paper.
      </p>
      {licences.length === 0 ? (
        <p className="text-stone-600">No patterns yet.</p>
      ) : (
        <table className="w-full border-collapse text-sm">
          <thead className="border-b border-linen-200 text-left text-stone-600">
            <tr>
              <th scope="col" className="px-2 py-2">Pattern</th>
              {/* On a phone the designer, licence and date go under the pattern's name (below). */}
              <th scope="col" className="hidden px-2 py-2 sm:table-cell">Designer</th>
              <th scope="col" className="hidden px-2 py-2 sm:table-cell">Licence</th>
              <th scope="col" className="hidden px-2 py-2 sm:table-cell">Bought</th>
              <th scope="col" className="px-2 py-2"><span className="sr-only">Actions</span></th>
            </tr>
          </thead>
          <tbody>
            {licences.map((licence) => (
              <tr key={licence.id} className="border-b border-linen-100" data-testid="licence-row">
                <td className="px-2 py-2 font-medium text-stone-800">
                  {licence.patternName}
                  {licence.patternState === 'retired' && <span className="ml-2 text-xs text-stone-500">(no longer sold; yours to print)</span>}
                  <span className="mt-1 block text-xs font-normal text-stone-600 sm:hidden">
                    {licence.designer} · <span className="font-mono">{licence.number}</span> · {licence.grantedAt.slice(0, 10)}
                  </span>
                </td>
                <td className="hidden px-2 py-2 sm:table-cell">{licence.designer}</td>
                <td className="hidden px-2 py-2 font-mono sm:table-cell">{licence.number}</td>
                <td className="hidden px-2 py-2 whitespace-nowrap sm:table-cell">{licence.grantedAt.slice(0, 10)}</td>
                <td className="px-2 py-2">
                  <div className="flex flex-wrap items-baseline gap-x-3 gap-y-1">
                    <Link href={`/library/${licence.id}/print`} className="text-thread-700 hover:underline">
                      Print
                    </Link>
                    <Link href={`/sewing-room/new?licence=${licence.id}`} className="text-thread-700 hover:underline">
                      Sewing room
                    </Link>
                    <GetBooklet licenceId={licence.id} patternName={licence.patternName} />
                  </div>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </article>
  )
}
