import Link from 'next/link'

/**
 * "Page 2 of 40" with links to the previous and next pages; `hrefFor` writes a page's address
 * with the list's other parameters kept.
 *
 * @example <Pager page={2} pageCount={40} total={1990} hrefFor={(page) => `/admin/audit?page=${page}`} />
 */
export function Pager({ page, pageCount, total, hrefFor, noun }: { page: number; pageCount: number; total: number; hrefFor: (page: number) => string; noun: string }) {
  const link = 'rounded border border-stone-300 px-3 py-1.5 hover:bg-linen-100'
  return (
    <nav aria-label="Pages" className="flex items-center gap-3 text-sm text-stone-700">
      <span data-testid="pager-status">
        Page {Math.min(page, pageCount)} of {pageCount} · {total} {noun}
      </span>
      {page > 1 && (
        <Link href={hrefFor(Math.min(page - 1, pageCount))} className={link} rel="prev">
          Previous
        </Link>
      )}
      {page < pageCount && (
        <Link href={hrefFor(page + 1)} className={link} rel="next">
          Next
        </Link>
      )}
    </nav>
  )
}
