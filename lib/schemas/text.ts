/**
 * The one string schema for free text a person types or a file carries: names, ids, fabric
 * roles, e-mail addresses. Every such field goes through `text()`, so the reply and the store
 * hold the same string: normalised to NFC and trimmed, then refused (422 naming the field) if it
 * holds a control character or a lone surrogate. PostgreSQL cannot store U+0000 in text or
 * JSONB, and a lone surrogate is not Unicode at all: either became a 500 before.
 */
import { z } from 'zod'

/** C0 and C1 control characters (U+0000–U+001F, U+007F–U+009F), NUL among them. */
const CONTROL = /\p{Cc}/u
/** Controls that are ordinary whitespace in text of several lines: tab, line feed, carriage return. */
const CONTROL_BUT_WHITESPACE = /(?![\t\n\r])\p{Cc}/u
/** With the u flag, a surrogate matches on its own only when it is not half of a pair. */
const LONE_SURROGATE = /\p{Cs}/u

export interface TextOptions {
  /** Most characters allowed (UTF-16 code units, as zod counts), after trimming. */
  readonly max: number
  /** Fewest characters, after trimming; default 1 (an empty name or id is no name). */
  readonly min?: number
  /** Allow tab, line feed and carriage return inside (text of several lines); default false. */
  readonly multiline?: boolean
  /** Messages; the defaults name the limit in plain words. */
  readonly messages?: { readonly required?: string; readonly empty?: string; readonly tooLong?: string }
}

/**
 * A string normalised to NFC and trimmed, with no control characters (but tab and line breaks
 * when `multiline`) and no lone surrogates, of `min`–`max` characters.
 *
 * @example text({ max: 10 }).parse('  Cafe\u0301 ') // 'Café' (NFC: one character é)
 */
export function text(options: TextOptions) {
  const { max, min = 1, multiline = false, messages = {} } = options
  const forbidden = multiline ? CONTROL_BUT_WHITESPACE : CONTROL
  return z
    .string(messages.required ? { error: messages.required } : undefined)
    .refine((value) => !LONE_SURROGATE.test(value), { message: 'a lone surrogate is not a character; check the text', abort: true })
    .normalize('NFC')
    .trim()
    .refine((value) => !forbidden.test(value), {
      message: multiline ? 'control characters are not allowed' : 'control characters (such as NUL, tab or a line break) are not allowed',
      abort: true,
    })
    .min(min, messages.empty ?? (min === 1 ? 'must not be empty' : `at least ${min} characters`))
    .max(max, messages.tooLong ?? `at most ${max} characters`)
}
