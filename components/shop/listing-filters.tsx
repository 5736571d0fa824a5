import Link from 'next/link'
import { MAX_REPEATS, MIN_REPEATS } from '@/lib/limits'
import { SHOP_SORTS, type ShopListingQuery, type ShopSort } from '@/lib/schemas/shop-listings'
import { COLOUR_FAMILIES, COLOUR_FAMILY_NAMES } from '@/lib/shop/colour-families'

const SORT_NAMES: Readonly<Record<ShopSort, string>> = { newest: 'Newest first', name: 'Name, A to Z', price: 'Price, low to high', '-price': 'Price, high to low' }
/** Price steps for the two price lists, in cents (the query's unit); shown as whole amounts. */
const FROM_CENTS = [500, 1000, 1500, 2000]
const UP_TO_CENTS = [1000, 1500, 2000, 3000]

const field = 'rounded border border-stone-300 bg-white px-2 py-1.5 text-sm'
const label = 'flex flex-col gap-1 text-xs font-medium text-stone-600'

/**
 * The shop's search, filters and order: a plain GET form to /shop, so it works without JavaScript;
 * its fields are the query string's parameters, the same the API reads.
 */
export function ListingFilters({ query }: { query: ShopListingQuery }) {
  return (
    <form method="get" action="/shop" role="search" aria-label="Find patterns" className="flex flex-wrap items-end gap-3 rounded-lg border border-linen-200 bg-white/70 p-4">
      <div className={`${label} grow`}>
        <label htmlFor="shop-q">Pattern or designer</label>
        <input type="search" id="shop-q" name="q" defaultValue={query.q ?? ''} maxLength={100} placeholder="e.g. holly" className={field} />
      </div>
      <div className={label}>
        <label htmlFor="shop-colour">Colour</label>
        <select id="shop-colour" name="colour" defaultValue={query.colour ?? ''} className={field}>
          <option value="">Any colour</option>
          {COLOUR_FAMILIES.map((family) => (
            <option key={family} value={family}>
              {COLOUR_FAMILY_NAMES[family]}
            </option>
          ))}
        </select>
      </div>
      <div className={label}>
        <label htmlFor="shop-repeats">Repeats</label>
        <input type="number" id="shop-repeats" name="repeats" min={MIN_REPEATS} max={MAX_REPEATS} step={1} defaultValue={query.repeats ?? ''} className={`${field} w-20`} />
      </div>
      <div className={label}>
        <label htmlFor="shop-minPriceCents">Price from</label>
        <select id="shop-minPriceCents" name="minPriceCents" defaultValue={query.minPriceCents ?? ''} className={field}>
          <option value="">Any</option>
          {FROM_CENTS.map((cents) => (
            <option key={cents} value={cents}>
              {cents / 100}
            </option>
          ))}
        </select>
      </div>
      <div className={label}>
        <label htmlFor="shop-maxPriceCents">Up to</label>
        <select id="shop-maxPriceCents" name="maxPriceCents" defaultValue={query.maxPriceCents ?? ''} className={field}>
          <option value="">Any</option>
          {UP_TO_CENTS.map((cents) => (
            <option key={cents} value={cents}>
              {cents / 100}
            </option>
          ))}
        </select>
      </div>
      <div className={label}>
        <label htmlFor="shop-sort">Order</label>
        <select id="shop-sort" name="sort" defaultValue={query.sort} className={field}>
          {SHOP_SORTS.map((sort) => (
            <option key={sort} value={sort}>
              {SORT_NAMES[sort]}
            </option>
          ))}
        </select>
      </div>
      {query.designer && <input type="hidden" name="designer" value={query.designer} />}
      <button type="submit" className="rounded bg-thread-700 px-4 py-1.5 text-sm text-white hover:bg-thread-800">
        Show patterns
      </button>
      <Link href="/shop" className="py-1.5 text-sm text-thread-700 hover:underline">
        Clear
      </Link>
    </form>
  )
}
