import type { Metadata } from 'next'
import Link from 'next/link'
import { ProjectList } from '@/components/sewing-room/project-list'
import { requireUser } from '@/lib/auth/current-user'
import { can } from '@/lib/authorization'
import { listPatternsToTest } from '@/lib/services/invitations'
import { listLibrary } from '@/lib/services/licences'

export const metadata: Metadata = { title: 'Sewing room' }

/**
 * The sewing room: the quilter's projects with their progress, and the patterns a project can be
 * started from — every licence in their library, and every pattern they test.
 */
export default async function SewingRoomPage() {
  const user = await requireUser(undefined, '/sewing-room')
  const [licences, toTest] = await Promise.all([
    can(user, 'read-own-library') ? listLibrary(user) : [],
    can(user, 'list-patterns-to-test') ? listPatternsToTest(user) : [],
  ])
  const startable = [
    ...licences.map((licence) => ({ key: licence.id, name: licence.patternName, by: licence.designer, href: `/sewing-room/new?licence=${licence.id}`, note: null })),
    ...toTest
      .filter((pattern) => pattern.open)
      .map((pattern) => ({ key: pattern.patternId, name: pattern.name, by: pattern.designerName, href: `/sewing-room/new?testing=${pattern.patternId}`, note: 'testing' })),
  ]
  return (
    <article className="mx-auto max-w-4xl space-y-8">
      <header className="space-y-2">
        <h1 className="text-2xl font-semibold text-thread-800">Sewing room</h1>
        <p className="max-w-2xl text-stone-700">
          Each project is one quilt: the whole job as a checklist, with the next step always on top. Tick steps on your phone at the
          sewing table and see them on every other device.
        </p>
      </header>
      <section aria-labelledby="projects-heading" className="space-y-3">
        <h2 id="projects-heading" className="text-lg font-semibold text-stone-900">
          Your projects
        </h2>
        <ProjectList />
      </section>
      <section aria-labelledby="start-heading" className="space-y-3">
        <h2 id="start-heading" className="text-lg font-semibold text-stone-900">
          Start a project
        </h2>
        {startable.length === 0 ? (
          <p className="text-stone-700">
            Patterns you buy in the <Link href="/shop" className="text-thread-700 underline">shop</Link> (or are invited to test) can be
            started here.
          </p>
        ) : (
          <ul className="divide-y divide-linen-200 rounded-2xl border border-linen-200 bg-white" data-testid="startable">
            {startable.map((item) => (
              <li key={item.key} className="flex items-center gap-3 p-3">
                <span className="min-w-0 flex-1">
                  <span className="block font-medium text-stone-900">{item.name}</span>
                  <span className="block text-sm text-stone-600">
                    {item.by ? `By ${item.by}` : ''}
                    {item.note ? ` · you are ${item.note} it` : ''}
                  </span>
                </span>
                <Link href={item.href} className="inline-flex min-h-11 items-center rounded-lg bg-thread-700 px-4 font-semibold text-white hover:bg-thread-800">
                  Start<span className="sr-only"> a project of {item.name}</span>
                </Link>
              </li>
            ))}
          </ul>
        )}
        <p className="text-sm text-stone-600">You can make one pattern more than once: each start is a project of its own.</p>
      </section>
    </article>
  )
}
