import type { Metadata } from 'next'
import localFont from 'next/font/local'
import type { ReactNode } from 'react'
import { SiteHeader } from '@/components/site-header'
import './globals.css'

// Inter ships in fonts/ (SIL Open Font License); nothing is fetched at build or run time.
const inter = localFont({
  src: [
    { path: '../fonts/inter-latin-wght-normal.woff2', weight: '100 900', style: 'normal' },
    { path: '../fonts/inter-latin-ext-wght-normal.woff2', weight: '100 900', style: 'normal' },
  ],
  variable: '--font-inter',
  display: 'swap',
})

export const metadata: Metadata = {
  title: { default: 'Wreathwright', template: '%s · Wreathwright' },
  description: 'Draft circular foundation-paper-pieced quilt patterns, prove they can be sewn, print and sell them.',
}

export default function RootLayout({ children }: { children: ReactNode }) {
  return (
    <html lang="en" className={inter.variable}>
      <body className="min-h-screen font-sans">
        <SiteHeader />
        <main className="px-4 py-6">{children}</main>
      </body>
    </html>
  )
}
