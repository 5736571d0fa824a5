import type { ReactElement } from 'react'

/** One kind of message: its subject and its body as a React element (the HTML part; the text part is made from it). */
export interface MailTemplate<Data> {
  subject(data: Data): string
  body(data: Data): ReactElement
}
