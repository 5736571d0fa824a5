import { describe, expect, it } from 'vitest'
import { originSettings, type ServerEnv } from './env'

const env = (overrides: Partial<ServerEnv>): ServerEnv => ({
  DATABASE_URL: 'postgres://127.0.0.1/x',
  NODE_ENV: 'development',
  DATABASE_LOG: 'false',
  TRUST_PROXY: 'false',
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
