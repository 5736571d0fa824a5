import { z } from 'zod'
import { text } from './text'

export const emailSchema = text({ max: 254, messages: { required: 'Enter your e-mail address.', empty: 'Enter your e-mail address.' } })
  .toLowerCase()
  .pipe(z.email({ error: 'Enter a valid e-mail address.' }).max(254))

/** At least 10 characters (NIST SP 800-63B asks for 8 at minimum; we ask a little more). */
export const newPasswordSchema = z
  .string({ error: 'Choose a password.' })
  .min(10, 'Use at least 10 characters.')
  .max(200, 'Use at most 200 characters.')

export const signUpSchema = z
  .object({
    email: emailSchema,
    password: newPasswordSchema,
    displayName: text({ max: 80, messages: { required: 'Tell us your name.', empty: 'Tell us your name.' } }),
    /** Ask for a designer account as well: granted at once (an admin can also grant it later). */
    wantsDesignerAccount: z.boolean().default(false),
  })
  .strict()
export type SignUpInput = z.infer<typeof signUpSchema>

export const signInSchema = z
  .object({
    email: emailSchema,
    password: z.string({ error: 'Enter your password.' }).min(1, 'Enter your password.').max(200),
  })
  .strict()
export type SignInInput = z.infer<typeof signInSchema>
