import type { Metadata } from 'next'
import Link from 'next/link'
import { redirect } from 'next/navigation'
import { ListingSettingsForm } from '@/components/patterns/listing-settings'
import { PatternStateControls, PriceForm } from '@/components/patterns/pattern-life'
import { STATE_NAMES } from '@/components/patterns/pattern-life-words'
import { TesterInvitations } from '@/components/patterns/tester-invitations'
import { PrintDialog } from '@/components/print/print-dialog'
import { requireUser } from '@/lib/auth/current-user'
import { can } from '@/lib/authorization'
import { UnreadableDesign } from '@/components/patterns/unreadable-design'
import { StoredDesignError } from '@/lib/errors'
import { loadForPatternPage } from '@/lib/pattern-page'
import { listInvitations } from '@/lib/services/invitations'
import { getPattern, listRevisions, listStateChanges } from '@/lib/services/patterns'
import { getListingSettings } from '@/lib/services/shop-listings'

export const metadata: Metadata = { title: 'Pattern' }

export default async function PatternPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params
  const user = await requireUser(undefined, `/patterns/${id}`)
  const loaded = await loadForPatternPage(Promise.all([getPattern(user, id), listRevisions(user, id)]))
  if (loaded instanceof StoredDesignError) return <UnreadableDesign error={loaded} />
  const [pattern, revisions] = loaded
  // A designer who tests someone else's pattern reads it on the tester's page.
  if (!can(user, 'update-pattern', { ownerId: pattern.ownerId, state: pattern.state })) redirect(`/testing/${pattern.id}`)
  const [stateChanges, invitations, listing] = await Promise.all([listStateChanges(user, id), listInvitations(user, id), getListingSettings(user, id)])
  const { ring } = pattern.design
  const unit = pattern.design.units
  return (
    <article className="mx-auto max-w-6xl space-y-6">
      <Link href="/patterns" className="text-sm text-thread-700 hover:underline">
        ← Pattern shelf
      </Link>
      <h1 className="text-2xl font-semibold text-thread-800">{pattern.name}</h1>
      <div className="flex gap-3">
        <Link href={`/patterns/${pattern.id}/board`} className="rounded bg-thread-700 px-4 py-2 text-white hover:bg-thread-800">
          Open the drafting board
        </Link>
        <Link href="#print" className="rounded border border-stone-300 px-4 py-2 hover:bg-linen-100">
          Print the booklet
        </Link>
        <Link href={`/patterns/${pattern.id}/fabric`} className="rounded border border-stone-300 px-4 py-2 hover:bg-linen-100">
          Fabric and cutting
        </Link>
        <Link href={`/patterns/${pattern.id}/reports`} className="rounded border border-stone-300 px-4 py-2 hover:bg-linen-100">
          Test reports
        </Link>
      </div>
      <dl className="grid max-w-xl grid-cols-2 gap-x-6 gap-y-2 text-sm">
        <dt className="text-stone-500">State</dt>
        <dd>{pattern.state}</dd>
        <dt className="text-stone-500">Revision</dt>
        <dd>{pattern.revision}</dd>
        <dt className="text-stone-500">Finished diameter</dt>
        <dd>
          {2 * ring.outerRadius} {unit}
        </dd>
        <dt className="text-stone-500">Repeats</dt>
        <dd>
          {ring.repeats} ({ring.repeatMode === 'mirror' ? 'alternately mirrored' : 'rotated'})
          {ring.innerRadius > 0 ? `, centre opening ${2 * ring.innerRadius} ${unit} across` : ', meeting at the centre'}
        </dd>
        <dt className="text-stone-500">Seams in one repeat</dt>
        <dd>{pattern.design.seams.length}</dd>
        <dt className="text-stone-500">Leaf inserts in one repeat</dt>
        <dd>{pattern.design.leaves?.length ?? 0}</dd>
        <dt className="text-stone-500">Colourways</dt>
        <dd>{(pattern.design.colorways ?? []).map((colorway) => colorway.name).join(', ') || 'none yet'}</dd>
      </dl>
      <section aria-labelledby="life-heading" className="space-y-4 rounded-lg border border-linen-200 bg-white p-6">
        <h2 id="life-heading" className="text-lg font-semibold">
          State and price
        </h2>
        <PatternStateControls patternId={pattern.id} state={pattern.state} revision={pattern.revision} />
        <p className="max-w-xl text-sm text-stone-600">
          Testing and publishing need a sewing plan without an error and a colourway that gives every fabric role a fabric;
          publishing also needs a price.
        </p>
        <PriceForm patternId={pattern.id} revision={pattern.revision} priceCents={pattern.priceCents ?? null} currency={pattern.currency ?? null} />
      </section>
      <section aria-labelledby="listing-heading" className="space-y-3 rounded-lg border border-linen-200 bg-white p-6">
        <h2 id="listing-heading" className="text-lg font-semibold">
          In the shop
        </h2>
        <p className="max-w-xl text-sm text-stone-600">
          What quilters see with the pattern once it is published.
          {pattern.state === 'published' && (
            <>
              {' '}
              <Link href={`/shop/${pattern.id}`} className="text-thread-700 hover:underline">
                See it in the shop
              </Link>
            </>
          )}
        </p>
        <ListingSettingsForm patternId={pattern.id} settings={listing} />
      </section>
      <section aria-labelledby="testers-heading" className="space-y-3 rounded-lg border border-linen-200 bg-white p-6">
        <h2 id="testers-heading" className="text-lg font-semibold">
          Testers
        </h2>
        <p className="max-w-xl text-sm text-stone-600">
          Invite quilters by e-mail. Once their address is confirmed they see this pattern while it is in testing and print
          it free, each page marked as their test copy.
        </p>
        <TesterInvitations patternId={pattern.id} invitations={invitations} canInvite={pattern.state === 'draft' || pattern.state === 'testing'} />
      </section>
      <section id="print" aria-labelledby="print-heading" className="space-y-3 rounded-lg border border-linen-200 bg-white p-6">
        <h2 id="print-heading" className="text-lg font-semibold">
          Print the booklet
        </h2>
        <p className="max-w-xl text-sm text-stone-600">
          One PDF: cover, cutting list, sewing steps, the foundations mirrored at exact scale and tiled across your
          paper, templates and a placement guide, made in your browser from revision {pattern.revision}.
        </p>
        <PrintDialog name={pattern.name} design={pattern.design} />
      </section>
      <section aria-labelledby="history-heading">
        <h2 id="history-heading" className="mb-2 text-lg font-semibold">
          History
        </h2>
        {stateChanges.length === 0 ? (
          <p className="text-sm text-stone-600">Still {STATE_NAMES[pattern.state]}, as it was made.</p>
        ) : (
          <ol className="space-y-1 text-sm" data-testid="state-history">
            {stateChanges.map((change) => (
              <li key={`${change.at}-${change.to}`}>
                From {STATE_NAMES[change.from]} to {STATE_NAMES[change.to]} by {change.by ?? 'a former member'},{' '}
                <time dateTime={change.at}>{new Date(change.at).toLocaleString()}</time>
              </li>
            ))}
          </ol>
        )}
      </section>
      <section>
        <h2 className="mb-2 text-lg font-semibold">Saved revisions</h2>
        <ol className="space-y-1 text-sm">
          {revisions.map((revision) => (
            <li key={revision.revision}>
              Revision {revision.revision} — “{revision.name}”, {revision.state},{' '}
              <time dateTime={revision.createdAt}>{new Date(revision.createdAt).toLocaleString()}</time>
            </li>
          ))}
        </ol>
      </section>
    </article>
  )
}
