import 'server-only'
import type { ZxcvbnFactory } from '@zxcvbn-ts/core'
import { ValidationError } from '@/lib/errors'

/**
 * The one strength rule for a new password (sign-up, reset, change), checked on the server with
 * zxcvbn-ts, a port of Dropbox's estimator. Its dictionaries are a few megabytes, so they are
 * loaded here on first use and never sent to the browser: the form checks only the length
 * (lib/schemas/account.ts) and shows this module's reason from the server's 422.
 *
 * A score of 3 of 4 ("safely unguessable: moderate protection from offline slow-hash scenario",
 * zxcvbn's own scale) is required, as the estimator's authors suggest for sign-up forms.
 */
export const MINIMUM_PASSWORD_SCORE = 3

let estimator: Promise<ZxcvbnFactory> | undefined

/** The estimator with the common and English dictionaries, built once per process. */
function loadEstimator(): Promise<ZxcvbnFactory> {
  estimator ??= (async () => {
    const [{ ZxcvbnFactory }, common, english] = await Promise.all([
      import('@zxcvbn-ts/core'),
      import('@zxcvbn-ts/language-common'),
      import('@zxcvbn-ts/language-en'),
    ])
    return new ZxcvbnFactory({
      translations: english.translations,
      graphs: common.adjacencyGraphs,
      dictionary: { ...common.dictionary, ...english.dictionary },
    })
  })()
  return estimator
}

/** Why a password is too weak, in zxcvbn's words; null when it is strong enough. */
export async function passwordWeakness(password: string, personalWords: readonly string[] = []): Promise<string | null> {
  const result = (await loadEstimator()).check(password, [...personalWords])
  if (result.score >= MINIMUM_PASSWORD_SCORE) return null
  const { warning, suggestions } = result.feedback
  const reason = [warning, ...suggestions].filter((part): part is string => Boolean(part)).join(' ')
  return `This password is too easy to guess. ${reason || 'Add more words or characters that do not follow a pattern.'}`.trim()
}

/**
 * Throws a 422 naming `field` when the password is too weak. The person's own e-mail address and
 * name count as guessable words.
 */
export async function requireStrongPassword(password: string, personalWords: readonly string[] = [], field = 'password'): Promise<void> {
  const weakness = await passwordWeakness(password, personalWords)
  if (weakness) throw new ValidationError([{ path: field, message: weakness }])
}
