import { describe, expect, it } from 'vitest'
import { passwordWeakness, requireStrongPassword } from './password-strength'

describe('password strength (zxcvbn-ts, score 3 of 4 needed)', () => {
  it('accepts a long phrase of ordinary words', async () => {
    expect(await passwordWeakness('pressing-seams-open')).toBeNull()
  })

  it('refuses a common password with the estimator\'s own warning and suggestion', async () => {
    // zxcvbn-ts 4.2 with the English dictionary: "password1234" scores 1 and is "similar to a commonly used password".
    expect(await passwordWeakness('password1234')).toBe(
      'This password is too easy to guess. This is similar to a commonly used password. Add more words that are less common.',
    )
  })

  it('counts the person\'s own name and address as guessable', async () => {
    expect(await passwordWeakness('hazelmarsh2026')).toBeNull()
    expect(await passwordWeakness('hazelmarsh2026', ['Hazel Marsh', 'hazelmarsh@example.test', 'hazelmarsh2026'])).not.toBeNull()
  })

  it('names the field it refuses', async () => {
    await expect(requireStrongPassword('aaaaaaaaaaaa', [], 'newPassword')).rejects.toMatchObject({ status: 422, issues: [{ path: 'newPassword' }] })
  })
})
