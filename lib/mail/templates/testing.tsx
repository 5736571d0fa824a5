import type { MailData } from '../kinds'
import type { MailTemplate } from './template'
import { ActionLink, MailLayout, Paragraph } from './layout'

/** Pattern testing (issue 13): a designer invites someone to sew a pattern before it is sold. */

export const testerInvitation: MailTemplate<MailData['tester-invitation']> = {
  subject: ({ designerName, patternName }) => `${designerName} invites you to test “${patternName}” on Wreathwright`,
  body: ({ displayName, designerName, patternName, hasAccount, actionUrl, expiresOn }) => (
    <MailLayout title={`Test “${patternName}”`}>
      <Paragraph>Hello {displayName},</Paragraph>
      <Paragraph>
        {designerName} would like you to test their pattern “{patternName}” before it goes on sale: print the booklet
        free of charge, in any colourway, size and paper, sew it, and tell them what could be clearer.
      </Paragraph>
      {hasAccount ? (
        <>
          <Paragraph>It is waiting in your list of patterns to test:</Paragraph>
          <ActionLink href={actionUrl}>Open the pattern</ActionLink>
        </>
      ) : (
        <>
          <Paragraph>
            Create a free Wreathwright account with this e-mail address (or sign in, if you have one), confirm the address
            from the message we send you, and the pattern opens for you.
          </Paragraph>
          <ActionLink href={actionUrl}>Accept the invitation</ActionLink>
        </>
      )}
      <Paragraph>The invitation stands until {expiresOn}. If you did not expect it, ignore this message: nothing happens.</Paragraph>
    </MailLayout>
  ),
}
