/**
 * A cover drawn on the server (lib/shop/cover-svg.ts) placed inline in the page: no script, no
 * image request. The SVG is our own text: numbers, `#rrggbb` colours and escaped names only.
 */
export function RingCover({ svg, label, className }: { svg: string | null; label: string; className?: string }) {
  if (!svg) {
    return (
      <div className={`flex aspect-square items-center justify-center rounded-full bg-linen-100 text-xs text-stone-500 ${className ?? ''}`} role="img" aria-label={label}>
        No preview
      </div>
    )
  }
  return <div className={`aspect-square [&>svg]:h-full [&>svg]:w-full ${className ?? ''}`} data-testid="ring-cover" dangerouslySetInnerHTML={{ __html: svg }} />
}
