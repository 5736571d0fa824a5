import type { Metadata } from 'next'
import Link from 'next/link'
import { notFound } from 'next/navigation'
import { UnreadableDesign } from '@/components/patterns/unreadable-design'
import { StartProjectForm, type ColorwayChoice } from '@/components/sewing-room/start-project-form'
import { requireUser } from '@/lib/auth/current-user'
import { NotFoundError, StoredDesignError } from '@/lib/errors'
import type { DesignFile } from '@/lib/schemas/design'
import { listPatternsToTest } from '@/lib/services/invitations'
import { getLicensedPattern } from '@/lib/services/licences'
import { getPatternForPrint } from '@/lib/services/patterns'
import { unitsPerInch } from '@/lib/units'

export const metadata: Metadata = { title: 'Start a project' }

type Grant = { licenceId: string } | { invitationId: string }

/**
 * Starting a project in the sewing room, from a licence (`?licence=<licence id>`, the library's
 * link) or a tester's invitation (`?testing=<pattern id>`, the tester's page's link). Someone
 * else's licence or pattern: not found.
 */
export default async function StartProjectPage({ searchParams }: { searchParams: Promise<{ licence?: string; testing?: string }> }) {
  const { licence, testing } = await searchParams
  const from = `/sewing-room/new?${licence ? `licence=${encodeURIComponent(licence)}` : `testing=${encodeURIComponent(testing ?? '')}`}`
  const user = await requireUser(undefined, from)
  let loaded: { grant: Grant; name: string; design: DesignFile; back: { href: string; label: string } }
  try {
    if (licence) {
      const { pattern } = await getLicensedPattern(user, licence)
      loaded = { grant: { licenceId: licence }, name: pattern.name, design: pattern.design, back: { href: '/library', label: 'My library' } }
    } else if (testing) {
      const { pattern, asTester } = await getPatternForPrint(user, testing)
      // The tester's pages know the pattern; the project is started under the live invitation to it.
      const invitationId = asTester ? (await listPatternsToTest(user)).find((entry) => entry.patternId === pattern.id && entry.open)?.invitationId : undefined
      if (!invitationId) notFound()
      loaded = { grant: { invitationId }, name: pattern.name, design: pattern.design, back: { href: `/testing/${pattern.id}`, label: pattern.name } }
    } else notFound()
  } catch (error) {
    if (error instanceof StoredDesignError) return <UnreadableDesign error={error} />
    if (error instanceof NotFoundError) notFound()
    throw error
  }
  const { design } = loaded
  const colorways: ColorwayChoice[] = (design.colorways ?? []).map((colorway, index) => ({
    index,
    name: colorway.name,
    fabrics: Object.entries(colorway.fabrics).map(([role, fabric]) => ({ role, name: fabric.name, color: fabric.color })),
  }))
  // The design's own size in inches, to the nearest quarter inch (the size field's step).
  const designDiameterIn = Math.round(((2 * design.ring.outerRadius) / unitsPerInch(design.units)) * 4) / 4
  return (
    <article className="mx-auto max-w-3xl space-y-5">
      <Link href={loaded.back.href} className="inline-block py-2 text-sm text-thread-700 hover:underline">
        ← {loaded.back.label}
      </Link>
      <h1 className="text-2xl font-semibold text-thread-800">Start a project: {loaded.name}</h1>
      <p className="text-stone-700">
        Choose what you are making. The sewing room then lists the whole job, from preparing the leaves to the binding, and keeps
        your place on every device you sign in on.
      </p>
      <StartProjectForm grant={loaded.grant} colorways={colorways} designDiameterIn={designDiameterIn} />
    </article>
  )
}
