import { describe, expect, it } from 'vitest'
import { MAIL_KINDS, type MailData, type MailKind } from './kinds'
import { renderMail } from './render'

const LINK = 'https://wreathwright.example/verify-email?token=tok3n-abc'

/** Sample data per kind; every string field can be replaced to try hostile values. */
function sample(kind: MailKind, displayName = 'Ada Lovelace'): MailData[MailKind] {
  const samples: MailData = {
    'verify-email': { displayName, verifyUrl: LINK },
    'sign-up-attempt': { displayName, signInUrl: 'https://wreathwright.example/sign-in', resetUrl: 'https://wreathwright.example/reset-password' },
    'password-reset': { displayName, resetUrl: 'https://wreathwright.example/reset-password?token=r3set' },
    'password-changed': { displayName },
    'email-change-verify': { displayName, verifyUrl: LINK, newEmail: 'new@example.com' },
    'email-change-notice': { displayName, newEmail: 'new@example.com' },
    'designer-request-decided': { displayName, approved: true, studioUrl: 'https://wreathwright.example/patterns' },
    'tester-invitation': { displayName, designerName: 'Mara Quill', patternName: 'Lantern Medallion', hasAccount: false, actionUrl: 'https://wreathwright.example/sign-up?next=/testing/p1', expiresOn: '1 January 2027' },
    'report-filed': { displayName, patternName: 'Lantern Medallion', authorName: 'Priya Desmond', kindName: 'Cutting', severityName: 'Blocks sewing', placeText: 'area A3', excerpt: 'The rough cut of A3 is too small.', reportUrl: 'https://wreathwright.example/patterns/p1/reports?report=r1' },
    'report-answered': { displayName, patternName: 'Lantern Medallion', authorName: 'Priya Desmond', kindName: 'Cutting', severityName: 'Blocks sewing', placeText: 'area A3', excerpt: 'The rough cut of A3 is too small.', reportUrl: 'https://wreathwright.example/patterns/p1/reports?report=r1' },
    'purchase-receipt': { displayName, patternName: 'Lantern Medallion', amount: '€12.50', licenceNumber: 'WL-001001', libraryUrl: 'https://wreathwright.example/library' },
    'pattern-sold': { displayName, patternName: 'Lantern Medallion', amount: '€12.50', patternUrl: 'https://wreathwright.example/patterns/p1' },
  }
  return samples[kind]
}

/** The links a kind's data holds: each must appear in both parts. */
const links = (data: object) => Object.values(data).filter((value): value is string => typeof value === 'string' && value.startsWith('https://'))

describe('renderMail', () => {
  it.each(MAIL_KINDS)('%s: a subject, an HTML part and a plain-text part saying the same', async (kind) => {
    const data = sample(kind)
    const mail = await renderMail(kind, data)
    expect(mail.subject.length).toBeGreaterThan(10)
    expect(mail.html).toMatch(/^<!DOCTYPE html><html lang="en">/)
    expect(mail.html).toContain('Hello Ada Lovelace,')
    expect(mail.text).toContain('Hello Ada Lovelace,')
    expect(mail.text).not.toMatch(/<[a-z]/i)
    expect(mail.html).toContain('Wreathwright')
    for (const link of links(data)) {
      expect(mail.html).toContain(`href="${link}"`)
      // html-to-text writes a link's address after its words: `Confirm my address [https://…]`.
      expect(mail.text).toContain(`[${link}]`)
    }
  })

  it.each(MAIL_KINDS)('%s: a display name or address is text, never markup', async (kind) => {
    const hostile = '<script>alert("x")</script> & <b>'
    const data = { ...sample(kind, hostile), ...('newEmail' in sample(kind) ? { newEmail: '"><img src=x>@example.com' } : {}) }
    const mail = await renderMail(kind, data)
    expect(mail.html).not.toContain('<script>')
    expect(mail.html).not.toContain('<img')
    expect(mail.html).toContain('&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt; &amp; &lt;b&gt;')
    // The text part is the plain words again.
    expect(mail.text).toContain('Hello <script>alert("x")</script> & <b>,')
  })

  it('escapes a link that tries to leave its attribute', async () => {
    const mail = await renderMail('password-reset', { displayName: 'Ada', resetUrl: 'https://wreathwright.example/r?a="><script>' })
    expect(mail.html).toContain('href="https://wreathwright.example/r?a=&quot;&gt;&lt;script&gt;"')
  })

  it('tells a designer request apart: approved with the studio link, declined without', async () => {
    const approved = await renderMail('designer-request-decided', { displayName: 'Ada', approved: true, studioUrl: 'https://wreathwright.example/patterns' })
    const declined = await renderMail('designer-request-decided', { displayName: 'Ada', approved: false, studioUrl: 'https://wreathwright.example/patterns' })
    expect(approved.subject).not.toBe(declined.subject)
    expect(approved.text).toContain('[https://wreathwright.example/patterns]')
    expect(declined.text).not.toContain('https://')
    expect(declined.text.replace(/\s+/g, ' ')).toContain('was not approved')
  })

  it('says how long a link lasts: 24 hours to verify, 1 hour to reset', async () => {
    expect((await renderMail('verify-email', { displayName: 'Ada', verifyUrl: LINK })).text).toContain('24 hours')
    expect((await renderMail('password-reset', { displayName: 'Ada', resetUrl: LINK })).text).toContain('next hour')
  })
})
