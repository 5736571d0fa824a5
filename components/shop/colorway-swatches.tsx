import type { ShopListing } from '@/lib/schemas/shop-listings'

/** A colourway's fabrics as a row of small squares, its name beside them. */
export function ColorwaySwatches({ colorway }: { colorway: ShopListing['colorways'][number] }) {
  return (
    <div className="flex items-center gap-1.5" data-testid="colorway-swatches">
      <span className="flex overflow-hidden rounded-sm border border-stone-300" aria-hidden="true">
        {colorway.colours.map((colour) => (
          <span key={colour} className="h-3.5 w-3.5" style={{ backgroundColor: colour }} title={colour} />
        ))}
      </span>
      <span className="text-xs text-stone-600">{colorway.name}</span>
    </div>
  )
}
