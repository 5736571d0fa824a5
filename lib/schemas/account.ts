import { z } from 'zod'
import { text } from './text'

/**
 * The inputs of signing up, signing in, e-mail links and the account page. Forms and route
 * handlers use the same schemas. How strong a new password must be is decided on the server only
 * (lib/password-strength.ts: its dictionaries are too large for the browser); the form shows the
 * server's reason on the password field.
 */

export const emailSchema = text({ max: 254, messages: { required: 'Enter your e-mail address.', empty: 'Enter your e-mail address.' } })
  .toLowerCase()
  .pipe(z.email({ error: 'Enter a valid e-mail address.' }).max(254))

/** At least 10 characters (NIST SP 800-63B asks for 8 at minimum; we ask a little more). */
export const newPasswordSchema = z
  .string({ error: 'Choose a password.' })
  .min(10, 'Use at least 10 characters.')
  .max(200, 'Use at most 200 characters.')

/** A password a person already has: any length the form allows. */
const currentPasswordSchema = z.string({ error: 'Enter your password.' }).min(1, 'Enter your password.').max(200)

export const displayNameSchema = text({ max: 80, messages: { required: 'Tell us your name.', empty: 'Tell us your name.' } })

export const signUpSchema = z
  .object({
    email: emailSchema,
    password: newPasswordSchema,
    displayName: displayNameSchema,
    /** Ask for a designer account as well: recorded as a request for an admin to approve. */
    wantsDesigner: z.boolean().default(false),
  })
  .strict()
export type SignUpInput = z.infer<typeof signUpSchema>

export const signInSchema = z
  .object({
    email: emailSchema,
    password: currentPasswordSchema,
  })
  .strict()
export type SignInInput = z.infer<typeof signInSchema>

/**
 * A token from an e-mail link. Any string up to a sane length is accepted here, so that a forged
 * or mangled token gets the same answer as a used or expired one (lib/auth/account-tokens.ts).
 */
const tokenSchema = z.string({ error: 'The link carries no token.' }).min(1, 'The link carries no token.').max(200, 'The link carries no token.')

export const verifyEmailSchema = z.object({ token: tokenSchema }).strict()

export const passwordResetRequestSchema = z.object({ email: emailSchema }).strict()

export const passwordResetConfirmSchema = z.object({ token: tokenSchema, password: newPasswordSchema }).strict()

export const displayNameChangeSchema = z.object({ displayName: displayNameSchema }).strict()

export const emailChangeSchema = z.object({ newEmail: emailSchema, currentPassword: currentPasswordSchema }).strict()
export type EmailChangeInput = z.infer<typeof emailChangeSchema>

export const passwordChangeSchema = z.object({ currentPassword: currentPasswordSchema, newPassword: newPasswordSchema }).strict()
export type PasswordChangeInput = z.infer<typeof passwordChangeSchema>

export const accountDeletionSchema = z
  .object({
    currentPassword: currentPasswordSchema,
    /** The person typed DELETE, so that one stray click deletes nothing. */
    confirm: z.literal('DELETE', { error: 'Type DELETE to confirm.' }),
  })
  .strict()
