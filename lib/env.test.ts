import { describe, expect, it } from 'vitest'
import { bookletSettings, mailSettings, objectStoreSettings, originSettings, type ServerEnv } from './env'

const env = (overrides: Partial<ServerEnv>): ServerEnv => ({
  DATABASE_URL: 'postgres://127.0.0.1/x',
  NODE_ENV: 'development',
  DATABASE_LOG: 'false',
  TRUST_PROXY: 'false',
  S3_REGION: 'us-east-1',
  S3_KEY_PREFIX: '',
  SMTP_HOST: '127.0.0.1',
  SMTP_SECURE: 'false',
  MAIL_FROM: 'Wreathwright <mail@wreathwright.example>',
  MAIL_WORKER: 'on',
  MAIL_RETRY_LIMIT: 6,
  MAIL_RETRY_DELAY_SECONDS: 30,
  MAIL_POLL_SECONDS: 2,
  PAYMENTS_WORKER: 'on',
  PAYMENTS_POLL_SECONDS: 1,
  BOOKLET_LINK_MINUTES: 10,
  BOOKLET_WORKER_CONCURRENCY: 2,
  BOOKLET_POLL_SECONDS: 1,
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

describe('mailSettings', () => {
  it('sends nothing until SMTP_PORT is set, from the product by name', () => {
    const settings = mailSettings(env({}))
    expect(settings.smtp).toBeNull()
    expect(settings.from).toBe('Wreathwright <mail@wreathwright.example>')
    expect(settings.viewUrl).toBeNull()
  })

  it('reaches the SMTP server named, with credentials only as a pair', () => {
    expect(mailSettings(env({ SMTP_PORT: 2525, SMTP_USER: 'mailer' })).smtp).toEqual({ host: '127.0.0.1', port: 2525, secure: false })
    expect(mailSettings(env({ SMTP_PORT: 465, SMTP_SECURE: 'true', SMTP_USER: 'mailer', SMTP_PASSWORD: 'pw' })).smtp).toEqual({
      host: '127.0.0.1',
      port: 465,
      secure: true,
      auth: { user: 'mailer', pass: 'pw' },
    })
  })

  it('links the catcher\'s web view and lets an instance leave the sending to others', () => {
    const settings = mailSettings(env({ MAIL_VIEW_URL: 'http://127.0.0.1:54331', MAIL_WORKER: 'off' }))
    expect(settings.viewUrl).toBe('http://127.0.0.1:54331')
    expect(settings.worker).toBe(false)
  })
})

describe('bookletSettings', () => {
  it('leaves the link secret to the process unless one is set, and counts link lives in seconds', () => {
    expect(bookletSettings(env({}))).toEqual({ linkSecret: null, linkSeconds: 600, workerConcurrency: 2, pollSeconds: 1 })
    const secret = 'x'.repeat(32)
    expect(bookletSettings(env({ BOOKLET_LINK_SECRET: secret, BOOKLET_LINK_MINUTES: 2, BOOKLET_WORKER_CONCURRENCY: 4 }))).toMatchObject({ linkSecret: secret, linkSeconds: 120, workerConcurrency: 4 })
  })
})
