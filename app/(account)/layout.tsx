import type { ReactNode } from 'react'

export default function AccountLayout({ children }: { children: ReactNode }) {
  return <div className="mx-auto mt-4 max-w-md rounded-lg border border-linen-200 bg-white p-8 shadow-sm">{children}</div>
}
