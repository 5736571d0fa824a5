import type { MailData } from '../kinds'
import type { MailTemplate } from './template'
import { ActionLink, MailLayout, Paragraph } from './layout'

/** The shop's messages (issue 14): the buyer's receipt and the designer's sale notice. */

export const purchaseReceipt: MailTemplate<MailData['purchase-receipt']> = {
  subject: ({ patternName }) => `Your Wreathwright receipt: ${patternName}`,
  body: ({ displayName, patternName, amount, licenceNumber, libraryUrl }) => (
    <MailLayout title="Your receipt">
      <Paragraph>Hello {displayName},</Paragraph>
      <Paragraph>
        Thank you for buying {patternName}. Your payment of {amount} is confirmed, and the pattern is now in your library with licence
        number {licenceNumber}.
      </Paragraph>
      <Paragraph>The licence is yours personally: every colourway, at any size, on your own paper, as often as you like.</Paragraph>
      <ActionLink href={libraryUrl}>Open my library</ActionLink>
      <Paragraph>Keep this message as your receipt.</Paragraph>
    </MailLayout>
  ),
}

export const patternSold: MailTemplate<MailData['pattern-sold']> = {
  subject: ({ patternName }) => `You sold a copy of ${patternName}`,
  body: ({ displayName, patternName, amount, patternUrl }) => (
    <MailLayout title="A sale">
      <Paragraph>Hello {displayName},</Paragraph>
      <Paragraph>
        A quilter just bought {patternName} for {amount}. The payment is confirmed and their licence is granted.
      </Paragraph>
      <ActionLink href={patternUrl}>Open the pattern</ActionLink>
    </MailLayout>
  ),
}
