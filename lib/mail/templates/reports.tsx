import type { ReportMailData } from '../kinds'
import type { MailTemplate } from './template'
import { ActionLink, MailLayout, Paragraph } from './layout'

/** Test reports (issue 13): a new report, an answer in its thread. */

function Quote({ text }: { text: string }) {
  return <blockquote style={{ margin: '0 0 14px', padding: '8px 14px', borderLeft: '3px solid #c9b98f', color: '#3d4a42', whiteSpace: 'pre-wrap' }}>{text}</blockquote>
}

export const reportFiled: MailTemplate<ReportMailData> = {
  subject: ({ patternName, placeText }) => `New test report on ${patternName}: ${placeText}`,
  body: ({ displayName, patternName, authorName, kindName, severityName, placeText, excerpt, reportUrl }) => (
    <MailLayout title={`New test report on ${patternName}`}>
      <Paragraph>Hello {displayName},</Paragraph>
      <Paragraph>
        {authorName} filed a report on {patternName} at {placeText}: {kindName.toLowerCase()}, {severityName.toLowerCase()}.
      </Paragraph>
      <Quote text={excerpt} />
      <ActionLink href={reportUrl}>Read the report</ActionLink>
    </MailLayout>
  ),
}

export const reportAnswered: MailTemplate<ReportMailData> = {
  subject: ({ patternName, placeText }) => `New answer on a test report of ${patternName} (${placeText})`,
  body: ({ displayName, patternName, authorName, kindName, placeText, excerpt, reportUrl }) => (
    <MailLayout title={`New answer on ${patternName}`}>
      <Paragraph>Hello {displayName},</Paragraph>
      <Paragraph>
        {authorName} answered on the report about {kindName.toLowerCase()} at {placeText} of {patternName}:
      </Paragraph>
      <Quote text={excerpt} />
      <ActionLink href={reportUrl}>Open the thread</ActionLink>
    </MailLayout>
  ),
}
