import type { ReactNode } from 'react'

/**
 * The frame every message shares: the product's name, the message, and a footer saying why it
 * came. Styles are inline because many mail programs drop <style> blocks. React escapes every
 * value it writes, so a display name or an address can never become markup.
 */
export function MailLayout({ title, children }: { title: string; children: ReactNode }) {
  return (
    <html lang="en">
      {/* eslint-disable-next-line @next/next/no-head-element -- a message's own document, not a Next.js page */}
      <head>
        <meta charSet="utf-8" />
        <meta name="viewport" content="width=device-width" />
        <title>{title}</title>
      </head>
      <body style={{ margin: 0, padding: '24px', backgroundColor: '#f4f1ea', fontFamily: 'Helvetica, Arial, sans-serif', color: '#24302a' }}>
        <div style={{ maxWidth: '560px', margin: '0 auto', backgroundColor: '#ffffff', borderRadius: '8px', padding: '28px' }}>
          <p style={{ margin: '0 0 20px', fontSize: '18px', fontWeight: 'bold', color: '#2f5540' }}>Wreathwright</p>
          {children}
          <p style={{ margin: '28px 0 0', fontSize: '12px', color: '#6b766f' }}>
            You get this message because this address belongs to a Wreathwright account, or someone entered it on Wreathwright.
          </p>
        </div>
      </body>
    </html>
  )
}

export function Paragraph({ children }: { children: ReactNode }) {
  return <p style={{ margin: '0 0 14px', fontSize: '15px', lineHeight: '1.5' }}>{children}</p>
}

/** The message's one action, as a button; the text part shows its address beside the words. */
export function ActionLink({ href, children }: { href: string; children: ReactNode }) {
  return (
    <p style={{ margin: '20px 0' }}>
      <a href={href} style={{ display: 'inline-block', padding: '10px 18px', backgroundColor: '#2f5540', color: '#ffffff', borderRadius: '6px', textDecoration: 'none', fontWeight: 'bold' }}>
        {children}
      </a>
    </p>
  )
}
