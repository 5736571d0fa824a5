import type { MailData } from '../kinds'
import type { MailTemplate } from './template'
import { ActionLink, MailLayout, Paragraph } from './layout'

/** The account messages of issue 12: verifying an address, resetting and changing a password. */

export const verifyEmail: MailTemplate<MailData['verify-email']> = {
  subject: () => 'Confirm your e-mail address for Wreathwright',
  body: ({ displayName, verifyUrl }) => (
    <MailLayout title="Confirm your e-mail address">
      <Paragraph>Hello {displayName},</Paragraph>
      <Paragraph>Welcome to Wreathwright. Please confirm that this address is yours, so we can reach you about your account.</Paragraph>
      <ActionLink href={verifyUrl}>Confirm my address</ActionLink>
      <Paragraph>The link works once, for the next 24 hours. If you did not sign up, ignore this message and nothing happens.</Paragraph>
    </MailLayout>
  ),
}

export const signUpAttempt: MailTemplate<MailData['sign-up-attempt']> = {
  subject: () => 'Someone tried to sign up with your address',
  body: ({ displayName, signInUrl, resetUrl }) => (
    <MailLayout title="Someone tried to sign up with your address">
      <Paragraph>Hello {displayName},</Paragraph>
      <Paragraph>Someone just tried to make a new Wreathwright account with this address. You already have one, so no second account was made.</Paragraph>
      <Paragraph>If it was you, sign in instead:</Paragraph>
      <ActionLink href={signInUrl}>Sign in</ActionLink>
      <Paragraph>
        Forgot your password? <a href={resetUrl}>Choose a new one</a>. If it was not you, you need not do anything: your account is unchanged.
      </Paragraph>
    </MailLayout>
  ),
}

export const passwordReset: MailTemplate<MailData['password-reset']> = {
  subject: () => 'Choose a new Wreathwright password',
  body: ({ displayName, resetUrl }) => (
    <MailLayout title="Choose a new password">
      <Paragraph>Hello {displayName},</Paragraph>
      <Paragraph>We got a request to reset the password of your Wreathwright account. Choose a new one here:</Paragraph>
      <ActionLink href={resetUrl}>Choose a new password</ActionLink>
      <Paragraph>The link works once, for the next hour. If you did not ask for it, ignore this message: your password stays as it is.</Paragraph>
    </MailLayout>
  ),
}

export const passwordChanged: MailTemplate<MailData['password-changed']> = {
  subject: () => 'Your Wreathwright password was changed',
  body: ({ displayName }) => (
    <MailLayout title="Your password was changed">
      <Paragraph>Hello {displayName},</Paragraph>
      <Paragraph>The password of your Wreathwright account was just changed, and every other browser signed in to it was signed out.</Paragraph>
      <Paragraph>If that was you, all is well. If not, reset your password from the sign-in page right away.</Paragraph>
    </MailLayout>
  ),
}

export const emailChangeVerify: MailTemplate<MailData['email-change-verify']> = {
  subject: () => 'Confirm your new e-mail address for Wreathwright',
  body: ({ displayName, verifyUrl, newEmail }) => (
    <MailLayout title="Confirm your new e-mail address">
      <Paragraph>Hello {displayName},</Paragraph>
      <Paragraph>You asked to use {newEmail} for your Wreathwright account. Confirm it to make the change:</Paragraph>
      <ActionLink href={verifyUrl}>Use this address</ActionLink>
      <Paragraph>The link works once, for the next 24 hours. Until then your account keeps its old address.</Paragraph>
    </MailLayout>
  ),
}

export const emailChangeNotice: MailTemplate<MailData['email-change-notice']> = {
  subject: () => 'Your Wreathwright e-mail address is changing',
  body: ({ displayName, newEmail }) => (
    <MailLayout title="Your e-mail address is changing">
      <Paragraph>Hello {displayName},</Paragraph>
      <Paragraph>Someone signed in to your Wreathwright account asked to move it to {newEmail}. Once that address is confirmed, messages go there instead of here.</Paragraph>
      <Paragraph>If that was not you, sign in and change your password now.</Paragraph>
    </MailLayout>
  ),
}
