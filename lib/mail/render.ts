import { convert } from 'html-to-text'
import type { MailData, MailKind } from './kinds'
import { emailChangeNotice, emailChangeVerify, passwordChanged, passwordReset, signUpAttempt, verifyEmail } from './templates/account'
import { designerRequestDecided } from './templates/studio'
import { testerInvitation } from './templates/testing'
import { patternSold, purchaseReceipt } from './templates/shop'
import { reportAnswered, reportFiled } from './templates/reports'
import type { MailTemplate } from './templates/template'

/** One template per kind; a kind without one fails to compile. */
const TEMPLATES: { [K in MailKind]: MailTemplate<MailData[K]> } = {
  'verify-email': verifyEmail,
  'sign-up-attempt': signUpAttempt,
  'password-reset': passwordReset,
  'password-changed': passwordChanged,
  'email-change-verify': emailChangeVerify,
  'email-change-notice': emailChangeNotice,
  'designer-request-decided': designerRequestDecided,
  'tester-invitation': testerInvitation,
  'purchase-receipt': purchaseReceipt,
  'pattern-sold': patternSold,
  'report-filed': reportFiled,
  'report-answered': reportAnswered,
}

export interface RenderedMail {
  subject: string
  html: string
  text: string
}

/**
 * A message ready to send: the HTML part rendered from the kind's React template (React escapes
 * every value), the plain-text part converted from that HTML by html-to-text, links written
 * after their words as `Confirm my address [https://…]`.
 *
 * @example (await renderMail('password-changed', { displayName: 'Ada' })).subject // 'Your Wreathwright password was changed'
 */
export async function renderMail<K extends MailKind>(kind: K, data: MailData[K]): Promise<RenderedMail> {
  // Imported when used: `next build` refuses a static import of react-dom/server in server code
  // (it guards Server Components, which should not render HTML by hand); the worker is not one.
  const { renderToStaticMarkup } = await import('react-dom/server')
  const template = TEMPLATES[kind] as MailTemplate<MailData[K]>
  const html = `<!DOCTYPE html>${renderToStaticMarkup(template.body(data))}`
  const text = convert(html, {
    wordwrap: 78,
    selectors: [{ selector: 'a', options: { hideLinkHrefIfSameAsText: true } }],
  })
  return { subject: template.subject(data), html, text }
}
