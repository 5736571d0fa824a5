import { describe, expect, it } from 'vitest'
import { linkSecret, signDownloadToken, verifyDownloadToken } from './download-token'

const grant = { buildId: '5b1f0c2e-0000-4000-8000-000000000001', userId: '5b1f0c2e-0000-4000-8000-000000000002', expiresAt: 1_000_600 }
const secret = 'a-secret-long-enough-for-the-setting-32'

describe('booklet download tokens', () => {
  it('carry their grant back while unexpired', () => {
    expect(verifyDownloadToken(signDownloadToken(grant, secret), secret, 1_000_000)).toEqual(grant)
  })

  it('stop working at their expiry', () => {
    expect(verifyDownloadToken(signDownloadToken(grant, secret), secret, 1_000_600)).toBeNull()
  })

  it('refuse another secret, an altered payload or signature, and garble', () => {
    const token = signDownloadToken(grant, secret)
    expect(verifyDownloadToken(token, `${secret}!`, 0)).toBeNull()
    const [payload, signature] = token.split('.') as [string, string]
    const otherUser = Buffer.from(JSON.stringify([grant.buildId, 'someone-else', grant.expiresAt])).toString('base64url')
    expect(verifyDownloadToken(`${otherUser}.${signature}`, secret, 0)).toBeNull()
    expect(verifyDownloadToken(`${payload}.${signature.slice(0, -2)}AA`, secret, 0)).toBeNull()
    expect(verifyDownloadToken(`${payload}`, secret, 0)).toBeNull()
    expect(verifyDownloadToken('', secret, 0)).toBeNull()
  })

  it('uses one random secret per process when none is configured', () => {
    expect(linkSecret(null)).toBe(linkSecret(null))
    expect(linkSecret(null).length).toBeGreaterThanOrEqual(40)
    expect(linkSecret(secret)).toBe(secret)
  })
})
