import Link from 'next/link'
import type { ShopListing } from '@/lib/schemas/shop-listings'
import { formatPrice } from '@/lib/shop/price'
import { ColorwaySwatches } from './colorway-swatches'
import { finishedSize } from './finished-size'
import { ListingCover } from './listing-cover'

/** One pattern in the shop's list: its cover (uploaded, or the ring in the first colourway), name, designer, size, repeats, colourways and price. */
export function ListingCard({ listing, cover }: { listing: ShopListing; cover: string | null }) {
  return (
    <li className="flex flex-col gap-2 rounded-lg border border-linen-200 bg-white p-4 shadow-sm" data-testid="listing-card">
      <Link href={`/shop/${listing.id}`} className="group space-y-3">
        <ListingCover listing={listing} svg={cover} label={listing.coverUrl ? `${listing.name}, cover` : `${listing.name}, ${listing.colorways[0]?.name ?? 'no colourway'}`} className="mx-auto w-full max-w-64" />
        <h2 className="text-lg font-semibold text-thread-800 group-hover:underline">{listing.name}</h2>
      </Link>
      <p className="text-sm text-stone-700">by {listing.designer ?? 'a former designer'}</p>
      <p className="text-sm text-stone-600">
        {finishedSize(listing.finishedDiameterIn)} · {listing.repeats} repeats
      </p>
      <div className="flex flex-wrap gap-x-3 gap-y-1">
        {listing.colorways.map((colorway) => (
          <ColorwaySwatches key={colorway.name} colorway={colorway} />
        ))}
      </div>
      <p className="mt-auto pt-1 text-base font-semibold text-stone-800" data-testid="price">
        {formatPrice(listing.priceCents, listing.currency)}
      </p>
    </li>
  )
}
