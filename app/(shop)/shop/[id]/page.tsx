import type { Metadata } from 'next'
import Link from 'next/link'
import { notFound } from 'next/navigation'
import { BuyButton } from '@/components/shop/buy-button'
import { ColorwaySwatches } from '@/components/shop/colorway-swatches'
import { finishedSize } from '@/components/shop/finished-size'
import { HideListingButton } from '@/components/shop/hide-listing-button'
import { ListingCover } from '@/components/shop/listing-cover'
import { RingCover } from '@/components/shop/ring-cover'
import { getCurrentUser } from '@/lib/auth/current-user'
import { can } from '@/lib/authorization'
import { NotFoundError } from '@/lib/errors'
import { signInPathFor } from '@/lib/safe-redirect'
import { getShopPattern, shopCovers } from '@/lib/services/shop-listings'
import { formatPrice } from '@/lib/shop/price'

type Props = { params: Promise<{ id: string }> }

async function load(id: string) {
  try {
    return await getShopPattern(await getCurrentUser(), id)
  } catch (error) {
    if (error instanceof NotFoundError) notFound()
    throw error
  }
}

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { listing } = await load((await params).id)
  return { title: `${listing.name} · Shop` }
}

/**
 * A pattern in the shop: the ring in every colourway, its size, repeats, skill notes and price,
 * and "Buy". Open to everyone; anything not listed is not found. Admins may hide the listing.
 */
export default async function ShopPatternPage({ params }: Props) {
  const { id } = await params
  const user = await getCurrentUser()
  const { listing, hidden } = await load(id)
  const covers = await shopCovers(listing.colorways.map((colorway) => ({ listing, colorway: colorway.name })))
  const price = formatPrice(listing.priceCents, listing.currency)
  return (
    <article className="mx-auto max-w-6xl space-y-6">
      <p className="text-sm">
        <Link href="/shop" className="text-thread-700 hover:underline">
          ← Shop
        </Link>
      </p>
      <header className="flex flex-wrap items-start justify-between gap-4">
        <div className="space-y-1">
          <h1 className="text-2xl font-semibold text-thread-800">{listing.name}</h1>
          <p className="text-stone-700">by {listing.designer ?? 'a former designer'}</p>
        </div>
        <div className="space-y-2 text-right">
          <p className="text-2xl font-semibold text-stone-800" data-testid="price">
            {price}
          </p>
          <BuyButton patternId={listing.id} price={price} signInHref={user ? null : signInPathFor(`/shop/${listing.id}`)} colorways={listing.colorways.map((colorway) => colorway.name)} />
        </div>
      </header>
      {/* The designer's uploaded cover, when set; the rings in every colourway follow below either way. */}
      {listing.coverUrl && <ListingCover listing={listing} svg={null} label={`${listing.name}, cover`} eager className="w-full max-w-sm" />}
      <dl className="grid max-w-2xl grid-cols-[auto_1fr] gap-x-6 gap-y-1 text-sm">
        <dt className="text-stone-500">Finished size</dt>
        <dd>{finishedSize(listing.finishedDiameterIn)} as designed; the print room prints it at any size</dd>
        <dt className="text-stone-500">Repeats</dt>
        <dd>{listing.repeats} around the ring</dd>
        <dt className="text-stone-500">Colourways</dt>
        <dd>{listing.colorways.length === 0 ? 'none yet' : listing.colorways.length}</dd>
        <dt className="text-stone-500">Licence</dt>
        <dd>Personal: every colourway, any size, on your own paper</dd>
      </dl>
      {listing.skillNotes && (
        <section className="max-w-2xl space-y-1">
          <h2 className="text-lg font-semibold text-thread-800">Skills</h2>
          <p className="whitespace-pre-line text-stone-700" data-testid="skill-notes">
            {listing.skillNotes}
          </p>
        </section>
      )}
      <section className="space-y-3">
        <h2 className="text-lg font-semibold text-thread-800">In every colourway</h2>
        <ul className="grid gap-6 sm:grid-cols-2 lg:grid-cols-3">
          {listing.colorways.map((colorway, index) => (
            <li key={colorway.name} className="space-y-2 rounded-lg border border-linen-200 bg-white p-4" data-testid="colorway-preview" data-colorway={colorway.name}>
              <RingCover svg={covers[index] ?? null} label={`${listing.name}, colourway ${colorway.name}`} className="mx-auto w-full max-w-80" />
              <ColorwaySwatches colorway={colorway} />
            </li>
          ))}
        </ul>
      </section>
      {can(user, 'hide-listing') && <HideListingButton patternId={listing.id} hidden={hidden} />}
    </article>
  )
}
