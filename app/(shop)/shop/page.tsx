import type { Metadata } from 'next'
import { ListingCard } from '@/components/shop/listing-card'
import { ListingFilters } from '@/components/shop/listing-filters'
import { Pager } from '@/components/admin/pager'
import { readShopQuery, shopListingQuerySchema, type ShopListingQuery } from '@/lib/schemas/shop-listings'
import { listShopPatterns, shopCovers } from '@/lib/services/shop-listings'

export const metadata: Metadata = { title: 'Shop' }

/** The query string of a page of this list, empty fields and defaults left out. */
function hrefOf(query: ShopListingQuery, page: number): string {
  const search = new URLSearchParams()
  for (const [name, value] of Object.entries({ ...query, page })) {
    if (value === undefined || value === '' || (name === 'sort' && value === 'newest') || (name === 'page' && value === 1)) continue
    search.set(name, String(value))
  }
  const text = search.toString()
  return text ? `/shop?${text}` : '/shop'
}

/**
 * The shop: every published pattern for sale as a card, searched, filtered and ordered by the
 * query string (the form works without JavaScript), twelve to a page. Open to everyone.
 */
export default async function ShopPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const read = readShopQuery(await searchParams)
  // A query the shop cannot read (a hand-edited address) shows what was wrong, above the whole list.
  const query = read.ok ? read.query : shopListingQuerySchema.parse({})
  const list = await listShopPatterns(query)
  // A listing with an uploaded cover shows that image: no ring to draw for it.
  const drawn = list.patterns.filter((listing) => !listing.coverUrl)
  const rings = await shopCovers(drawn.map((listing) => ({ listing, colorway: listing.colorways[0]?.name ?? '' })))
  const covers = new Map(drawn.map((listing, index) => [listing.id, rings[index] ?? null]))
  const filtered = Boolean(query.q || query.designer || query.colour || query.repeats || query.minPriceCents !== undefined || query.maxPriceCents !== undefined)
  return (
    <article className="mx-auto max-w-6xl space-y-5">
      <header className="space-y-1">
        <h1 className="text-2xl font-semibold text-thread-800">Shop</h1>
        <p className="max-w-2xl text-stone-700">
          Foundation-pieced rings from our designers. Each pattern prints at any size on your own paper, in every colourway shown.
        </p>
      </header>
      <ListingFilters query={query} />
      {!read.ok && (
        <ul role="alert" className="space-y-1 text-sm text-madder-700">
          {read.issues.map((issue) => (
            <li key={issue.path}>
              {issue.path}: {issue.message}
            </li>
          ))}
        </ul>
      )}
      <p className="text-sm text-stone-600" data-testid="result-count">
        {list.total === 0 ? (filtered ? 'No pattern matches; try fewer filters.' : 'No patterns for sale yet.') : `${list.total} pattern${list.total === 1 ? '' : 's'}`}
      </p>
      {list.patterns.length > 0 && (
        <ul className="grid gap-5 sm:grid-cols-2 lg:grid-cols-3">
          {list.patterns.map((listing) => (
            <ListingCard key={listing.id} listing={listing} cover={covers.get(listing.id) ?? null} />
          ))}
        </ul>
      )}
      {list.pageCount > 1 && <Pager page={list.page} pageCount={list.pageCount} total={list.total} noun="patterns" hrefFor={(page) => hrefOf(query, page)} />}
    </article>
  )
}
