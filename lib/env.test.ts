import { describe, expect, it } from 'vitest'
import { objectStoreSettings, originSettings, type ServerEnv } from './env'

const env = (overrides: Partial<ServerEnv>): ServerEnv => ({
  DATABASE_URL: 'postgres://127.0.0.1/x',
  NODE_ENV: 'development',
  DATABASE_LOG: 'false',
  TRUST_PROXY: 'false',
  S3_REGION: 'us-east-1',
  S3_KEY_PREFIX: '',
  ...overrides,
})

describe('originSettings', () => {
  it('takes the origin of PUBLIC_URL, without its path', () => {
    expect(originSettings(env({ PUBLIC_URL: 'https://wreathwright.example/studio/', NODE_ENV: 'production' }))).toEqual({
      origins: ['https://wreathwright.example'],
      trustProxy: false,
    })
  })

  it('defaults to the loopback address npm run dev serves, on PORT', () => {
    expect(originSettings(env({})).origins).toEqual(['http://127.0.0.1:3000', 'http://localhost:3000'])
    expect(originSettings(env({ PORT: 4100 })).origins[0]).toBe('http://127.0.0.1:4100')
  })

  it('has no default in production', () => {
    expect(() => originSettings(env({ NODE_ENV: 'production' }))).toThrow(/PUBLIC_URL/)
  })

  it('trusts forwarded headers only when TRUST_PROXY says so', () => {
    expect(originSettings(env({ TRUST_PROXY: 'true' })).trustProxy).toBe(true)
  })
})

describe('objectStoreSettings', () => {
  it('is null until both the endpoint and the bucket are set: uploads then answer 503', () => {
    expect(objectStoreSettings(env({}))).toBeNull()
    expect(objectStoreSettings(env({ S3_ENDPOINT: 'http://127.0.0.1:9000' }))).toBeNull()
  })

  it('passes credentials only as a pair', () => {
    const settings = objectStoreSettings(env({ S3_ENDPOINT: 'http://127.0.0.1:9000', S3_BUCKET: 'uploads', S3_ACCESS_KEY_ID: 'id' }))
    expect(settings).toEqual({ endpoint: 'http://127.0.0.1:9000', bucket: 'uploads', region: 'us-east-1', credentials: undefined, keyPrefix: '' })
  })
})
