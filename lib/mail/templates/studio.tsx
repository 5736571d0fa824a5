import type { MailData } from '../kinds'
import type { MailTemplate } from './template'
import { ActionLink, MailLayout, Paragraph } from './layout'

export const designerRequestDecided: MailTemplate<MailData['designer-request-decided']> = {
  subject: ({ approved }) => (approved ? 'Your Wreathwright designer account is ready' : 'About your Wreathwright designer request'),
  body: ({ displayName, approved, studioUrl }) =>
    approved ? (
      <MailLayout title="Your designer account is ready">
        <Paragraph>Hello {displayName},</Paragraph>
        <Paragraph>Good news: your request for a designer account was approved. Your studio is open, with the drafting board and the print room.</Paragraph>
        <ActionLink href={studioUrl}>Open my studio</ActionLink>
      </MailLayout>
    ) : (
      <MailLayout title="About your designer request">
        <Paragraph>Hello {displayName},</Paragraph>
        <Paragraph>Thank you for asking for a designer account. This time the request was not approved. Your account keeps working as before, and you may ask again later.</Paragraph>
      </MailLayout>
    ),
}
