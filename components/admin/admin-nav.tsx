'use client'

import Link from 'next/link'
import { usePathname } from 'next/navigation'

const SECTIONS = [
  { href: '/admin/users', label: 'People' },
  { href: '/admin/requests', label: 'Designer requests' },
  { href: '/admin/mail', label: 'Mail log' },
  { href: '/admin/payments', label: 'Payment log' },
  { href: '/admin/audit', label: 'Audit log' },
] as const

/** The admin desk's sections, the current one marked for screen readers too. */
export function AdminNav() {
  const pathname = usePathname()
  return (
    <nav aria-label="Admin desk" className="flex flex-wrap items-center gap-2 border-b border-linen-200 pb-3">
      <span className="mr-4 text-lg font-semibold text-thread-800">Admin desk</span>
      {SECTIONS.map((section) => {
        const current = pathname === section.href
        return (
          <Link
            key={section.href}
            href={section.href}
            aria-current={current ? 'page' : undefined}
            className={`rounded px-3 py-1.5 text-sm ${current ? 'bg-thread-700 text-white' : 'text-stone-700 hover:bg-linen-100'}`}
          >
            {section.label}
          </Link>
        )
      })}
    </nav>
  )
}
