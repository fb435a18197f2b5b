import { afterAll, describe, expect, it } from 'vitest'
import { createHash } from 'node:crypto'
import { Client, goodPassword, signUp, uniqueEmail } from '../helpers/http'
import { linkFrom, mailTo, tokenOf, waitForMail } from '../helpers/mail'
import { sql } from '../helpers/db'

// Password reset by e-mail: the link is read from the message the fake SMTP server received.

afterAll(() => sql.end())

// each visitor its own client address, so the per-address limit of one test never trips another
const visitor = () => new Client(`10.251.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}`)
const sha256 = (text: string) => createHash('sha256').update(text).digest('hex')
const newPassword = 'a-brand-new-password-7'

async function requestReset(email: string) {
  const res = await visitor().post('/api/password-resets', { email })
  expect(res.status).toBe(202)
  const mail = await waitForMail(email, { subject: 'Reset' })
  const link = linkFrom(mail, '/reset-password/')
  return { mail, link, token: tokenOf(link) }
}

describe('password reset', () => {
  it('the mailed link sets a new password; the old password and every old session stop working', async () => {
    const { client: first, email } = await signUp('forgetful')
    const second = visitor()
    expect((await second.post('/api/session', { email, password: goodPassword })).status).toBe(200)

    const { link, token } = await requestReset(email)
    const page = await fetch(link)
    expect(page.status).toBe(200)
    expect(await page.text()).toContain(email)
    const stranger = visitor()
    expect((await stranger.get(`/api/password-resets/${token}`)).body.email).toBe(email)
    const weak = await stranger.post(`/api/password-resets/${token}/complete`, { password: 'short' })
    expect(weak.status).toBe(400)
    expect(weak.body.data.fields.password).toBeTruthy()

    expect((await stranger.post(`/api/password-resets/${token}/complete`, { password: newPassword })).status).toBe(200)
    for (const old of [first, second]) expect((await old.get('/api/projects')).status).toBe(401)
    const open = await sql`select count(*)::int as n from auth_sessions s join users u on u.id = s.user_id where u.email = ${email} and s.revoked_at is null`
    expect(open[0]!.n).toBe(0)
    expect((await visitor().post('/api/session', { email, password: goodPassword })).status).toBe(401)
    expect((await visitor().post('/api/session', { email, password: newPassword })).status).toBe(200)

    // single use
    const again = await visitor().post(`/api/password-resets/${token}/complete`, { password: 'yet-another-password-3' })
    expect(again.status).toBe(410)
    expect(again.body.data.reason).toBe('used')
    expect((await visitor().get(`/api/password-resets/${token}`)).status).toBe(410)
  })

  it('answers an unknown address exactly like a known one, and sends it nothing', async () => {
    const { email: known } = await signUp('known-address')
    const unknown = uniqueEmail('nobody-here')
    const forKnown = await visitor().post('/api/password-resets', { email: known })
    const forUnknown = await visitor().post('/api/password-resets', { email: unknown })
    expect(forUnknown.status).toBe(forKnown.status)
    expect(forUnknown.status).toBe(202)
    expect(forUnknown.body).toEqual(forKnown.body)
    // once the known address's mail has arrived the worker has been through the queue
    await waitForMail(known, { subject: 'Reset' })
    expect(await mailTo(unknown)).toHaveLength(0)
    expect((await sql`select count(*)::int as n from mail_outbox where to_address = ${unknown}`)[0]!.n).toBe(0)
  })

  it('refuses an expired link and leaves the password as it was', async () => {
    const { email } = await signUp('too-slow')
    const { token } = await requestReset(email)
    await sql`update password_resets set expires_at = now() - interval '1 second' where token_hash = ${sha256(token)}`
    const view = await visitor().get(`/api/password-resets/${token}`)
    expect(view.status).toBe(410)
    expect(view.body.data.reason).toBe('expired')
    expect((await visitor().post(`/api/password-resets/${token}/complete`, { password: newPassword })).status).toBe(410)
    expect((await visitor().post('/api/session', { email, password: goodPassword })).status).toBe(200)
    expect((await visitor().get('/api/password-resets/not-a-token')).status).toBe(404)
  })

  it('clears the must-change-password mark, and one reset closes the other open links', async () => {
    const { email } = await signUp('marked')
    await sql`update users set must_change_password = true where email = ${email}`
    const earlier = await requestReset(email)
    const before = (await mailTo(email)).length
    const res = await visitor().post('/api/password-resets', { email })
    expect(res.status).toBe(202)
    const later = tokenOf(linkFrom(await waitForMail(email, { subject: 'Reset', after: before }), '/reset-password/'))
    expect((await visitor().post(`/api/password-resets/${later}/complete`, { password: newPassword })).status).toBe(200)
    expect((await sql`select must_change_password from users where email = ${email}`)[0]!.must_change_password).toBe(false)
    expect((await visitor().post(`/api/password-resets/${earlier.token}/complete`, { password: 'other-new-password-5' })).status).toBe(410)
  })

  it('limits requests per address and per client, known address or not', async () => {
    const email = uniqueEmail('hammered')
    const statuses: number[] = []
    for (let i = 0; i < 4; i++) statuses.push((await visitor().post('/api/password-resets', { email })).status)
    // HOSEWRIGHT_RESET_MAX_PER_EMAIL defaults to 3
    expect(statuses).toEqual([202, 202, 202, 429])

    const one = visitor()
    const fromOne: number[] = []
    for (let i = 0; i < 20; i++) fromOne.push((await one.post('/api/password-resets', { email: uniqueEmail('spray') })).status)
    // HOSEWRIGHT_RESET_MAX_PER_IP defaults to 20
    expect(fromOne.every(s => s === 202)).toBe(true)
    const limited = await one.post('/api/password-resets', { email: uniqueEmail('spray') })
    expect(limited.status).toBe(429)
    expect(Number(limited.headers.get('retry-after'))).toBeGreaterThan(0)
    expect((await visitor().post('/api/password-resets', { email: 'not-an-address' })).status).toBe(400)
  })
})
