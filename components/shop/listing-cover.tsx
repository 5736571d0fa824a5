import type { ShopListing } from '@/lib/schemas/shop-listings'
import { RingCover } from './ring-cover'

/**
 * A listing's cover: the designer's uploaded image when they set one (served as stored, already
 * resized when it was uploaded: lib/images.ts MAX_COVER_SIDE), else the ring drawn from the design
 * (`svg`, lib/shop/cover-svg.ts). Square either way, so cards line up.
 */
export function ListingCover({
  listing,
  svg,
  label,
  className,
  eager = false,
}: {
  listing: Pick<ShopListing, 'coverUrl'>
  svg: string | null
  label: string
  className?: string
  /** Load at once (the pattern's own page); cards further down the list wait until scrolled to. */
  eager?: boolean
}) {
  if (!listing.coverUrl) return <RingCover svg={svg} label={label} className={className} />
  return (
    // eslint-disable-next-line @next/next/no-img-element -- stored at its shown size when uploaded; the image optimizer would resize it again per request
    <img
      src={listing.coverUrl}
      alt={label}
      loading={eager ? 'eager' : 'lazy'}
      decoding="async"
      className={`aspect-square rounded object-cover ${className ?? ''}`}
      data-testid="uploaded-cover"
    />
  )
}
