import { describe, expect, it } from 'vitest'
import { describeDevice } from './device'

describe('describeDevice', () => {
  it('names the browser, its major version and the system', () => {
    expect(describeDevice('Mozilla/5.0 (Windows NT 10.0; Win64; x64; rv:128.0) Gecko/20100101 Firefox/128.0')).toBe('Firefox 128 on Windows')
  })

  it('adds the model of a phone', () => {
    const iphone = 'Mozilla/5.0 (iPhone; CPU iPhone OS 17_1 like Mac OS X) AppleWebKit/605.1.15 (KHTML, like Gecko) Version/17.1 Mobile/15E148 Safari/604.1'
    expect(describeDevice(iphone)).toBe('Mobile Safari 17 on iOS, iPhone')
  })

  it('says so when there is nothing to go by', () => {
    expect(describeDevice(null)).toBe('An unknown browser')
    // ua-parser-js without its extensions knows no command-line clients.
    expect(describeDevice('curl/8.5.0')).toBe('An unknown browser')
  })
})
