import { afterEach, describe, expect, it } from 'vitest'
import { queueSettings, retryDelayMs } from '../../../server/mail/queue'

// The outbox back-off: waits grow after each failed attempt and stop growing at the last step.

const saved = { ...process.env }
afterEach(() => { process.env = { ...saved } })

describe('mail retry back-off', () => {
  it('waits 5 s, 30 s, 2 min, 10 min, 30 min, then 1 h for good, and gives up after 8 attempts', () => {
    delete process.env.HOSEWRIGHT_MAIL_RETRY_MS
    delete process.env.HOSEWRIGHT_MAIL_MAX_ATTEMPTS
    const settings = queueSettings()
    expect([1, 2, 3, 4, 5, 6, 7, 20].map(n => retryDelayMs(settings, n) / 1000)).toEqual([5, 30, 120, 600, 1800, 3600, 3600, 3600])
    expect(settings.maxAttempts).toBe(8)
  })

  it('takes its steps and limit from the environment, ignoring nonsense', () => {
    process.env.HOSEWRIGHT_MAIL_RETRY_MS = '500, 1000,abc,-3,2000'
    process.env.HOSEWRIGHT_MAIL_MAX_ATTEMPTS = '3'
    const settings = queueSettings()
    expect(settings.retryDelaysMs).toEqual([500, 1000, 2000])
    expect([1, 2, 3, 4].map(n => retryDelayMs(settings, n))).toEqual([500, 1000, 2000, 2000])
    expect(settings.maxAttempts).toBe(3)
    process.env.HOSEWRIGHT_MAIL_MAX_ATTEMPTS = 'zero'
    expect(queueSettings().maxAttempts).toBe(8)
  })
})
