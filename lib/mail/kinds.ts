/**
 * Every kind of message the product sends, with the data its template needs. A new kind (an
 * invitation, a receipt) adds a line here and a template in templates/; `queueMail` and the worker
 * then know it. Data is plain JSON: it waits in the queue until the worker renders it.
 */
export interface MailData {
  /** A new account's address to confirm; the link works for 24 hours. */
  'verify-email': { displayName: string; verifyUrl: string }
  /** Someone tried to sign up with an address that already has an account. */
  'sign-up-attempt': { displayName: string; signInUrl: string; resetUrl: string }
  /** A password reset link, valid for 1 hour and only once. */
  'password-reset': { displayName: string; resetUrl: string }
  /** The password was changed; every other session was ended. */
  'password-changed': { displayName: string }
  /** Sent to the new address when someone changes theirs: confirm it. */
  'email-change-verify': { displayName: string; verifyUrl: string; newEmail: string }
  /** Sent to the old address when someone changes theirs: so a stranger's change does not go unseen. */
  'email-change-notice': { displayName: string; newEmail: string }
  /** An admin approved or declined a request for a designer account. */
  'designer-request-decided': { displayName: string; approved: boolean; studioUrl: string }
  /**
   * A designer asks someone to test a pattern. `hasAccount`: the address's owner is a tester
   * already and the link opens the pattern; otherwise it leads to sign-up (or sign-in) and then
   * to the pattern. `expiresOn`: the last day, in words. `displayName`: the account's name, or
   * "there" for an address without one.
   */
  'tester-invitation': { displayName: string; designerName: string; patternName: string; hasAccount: boolean; actionUrl: string; expiresOn: string }
  /** A buyer's receipt once the payment is confirmed: the amount in words of its currency, the licence and the library. */
  'purchase-receipt': { displayName: string; patternName: string; amount: string; licenceNumber: string; libraryUrl: string }
  /** The designer's notice of a sale (no buyer's details: they are the buyer's own). */
  'pattern-sold': { displayName: string; patternName: string; amount: string; patternUrl: string }
  /** A tester filed a report on a pattern; sent to its designer and its other testers. */
  'report-filed': ReportMailData
  /** Someone answered in a report's thread; sent to the designer and the testers but the author. */
  'report-answered': ReportMailData
}

/** What a report's messages say: which pattern, who wrote, what and where, and the link to the thread. */
export interface ReportMailData {
  displayName: string
  patternName: string
  authorName: string
  /** The kind and severity in words ("Cutting", "Blocks sewing"). */
  kindName: string
  severityName: string
  /** Where, in words: "area A3", "step 4", "page 2", "a point on the board". */
  placeText: string
  /** The report's or the answer's text, shortened. */
  excerpt: string
  reportUrl: string
}

export type MailKind = keyof MailData

/** The kinds in a fixed order, for checks and for the admin's mail log filter. */
export const MAIL_KINDS = [
  'verify-email',
  'sign-up-attempt',
  'password-reset',
  'password-changed',
  'email-change-verify',
  'email-change-notice',
  'designer-request-decided',
  'tester-invitation',
  'purchase-receipt',
  'pattern-sold',
  'report-filed',
  'report-answered',
] as const satisfies readonly MailKind[]

/** Where a queued message stands, as the admin's mail log shows it. */
export const MAIL_STATES = ['queued', 'sent', 'failed'] as const
export type MailState = (typeof MAIL_STATES)[number]

/** The pg-boss queue every message goes through. */
export const MAIL_QUEUE = 'mail'

/** One job on the queue: the outgoing_mails row it belongs to and what to render. */
export interface MailJob<K extends MailKind = MailKind> {
  mailId: string
  to: string
  kind: K
  data: MailData[K]
}
