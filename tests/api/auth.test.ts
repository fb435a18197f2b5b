import { afterAll, describe, expect, it } from 'vitest'
import { Client, goodPassword, signUp, uniqueEmail } from '../helpers/http'
import { sql } from '../helpers/db'

afterAll(() => sql.end())

describe('sign-up', () => {
  it('creates an account, a workshop with the user as owner, and signs in', async () => {
    const { client, email, summary } = await signUp('signup')
    expect(summary.user.email).toBe(email)
    expect(summary.role).toBe('owner')
    expect(summary.workshop.name).toBe('Test shop signup')
    const me = await client.get('/api/session')
    expect(me.body.user.email).toBe(email)
  })

  it('normalises the e-mail and refuses a second account for it without leaving a stray workshop', async () => {
    const { email } = await signUp('dup')
    const [before] = await sql`select count(*)::int as n from workshops`
    const again = await new Client().post('/api/account', { name: 'X', email: `  ${email.toUpperCase()} `, password: goodPassword, workshopName: 'Second' })
    expect(again.status).toBe(400)
    expect(again.body.data.fields.email).toMatch(/already exists/)
    const [after] = await sql`select count(*)::int as n from workshops`
    expect(after!.n).toBe(before!.n)
  })

  it('answers bad input with field messages, never a 500', async () => {
    const res = await new Client().post('/api/account', { name: '', email: 'not-an-address', password: 'short', workshopName: '' })
    expect(res.status).toBe(400)
    expect(Object.keys(res.body.data.fields).sort()).toEqual(['email', 'name', 'password', 'workshopName'])
    const broken = await new Client().request('POST', '/api/account', '{"name":', { 'content-type': 'application/json' })
    expect(broken.status).toBe(400)
  })
})

describe('sign-in and sign-out', () => {
  it('says only that the e-mail or password is wrong', async () => {
    const { email } = await signUp('wrongpw')
    const wrongPassword = await new Client('198.51.100.7').post('/api/session', { email, password: 'not-the-password' })
    const unknownEmail = await new Client('198.51.100.7').post('/api/session', { email: uniqueEmail('nobody'), password: 'whatever-it-is' })
    expect(wrongPassword.status).toBe(401)
    expect(unknownEmail.status).toBe(401)
    expect(wrongPassword.body.message).toBe('The e-mail or password is wrong.')
    expect(unknownEmail.body.message).toBe(wrongPassword.body.message)
  })

  it('sets an HttpOnly, SameSite session cookie', async () => {
    const { email } = await signUp('cookie')
    const res = await new Client().post('/api/session', { email, password: goodPassword })
    const cookie = res.headers.getSetCookie().join('\n')
    expect(cookie).toMatch(/HttpOnly/i)
    expect(cookie).toMatch(/SameSite=Lax/i)
  })

  it('sign-out ends the session on the server: a copied cookie stops working', async () => {
    const { client } = await signUp('signout')
    const copy = new Client()
    copy.cookies = new Map(client.cookies)
    expect((await copy.get('/api/projects')).status).toBe(200)
    expect((await client.delete('/api/session')).status).toBe(200)
    expect((await client.get('/api/projects')).status).toBe(401)
    expect((await copy.get('/api/projects')).status).toBe(401)
  })

  it('an expired session is refused', async () => {
    const { client, summary } = await signUp('expiry')
    await sql`update auth_sessions set expires_at = now() - interval '1 minute' where user_id = ${summary.user.id}`
    expect((await client.get('/api/projects')).status).toBe(401)
    expect((await client.get('/api/session')).body.user).toBeNull()
  })

  it('each sign-in gets a new session id (no fixation)', async () => {
    const { email, summary } = await signUp('fixation')
    const a = new Client(); const b = new Client()
    await a.post('/api/session', { email, password: goodPassword })
    await b.post('/api/session', { email, password: goodPassword })
    const rows = await sql`select id from auth_sessions where user_id = ${summary.user.id} and revoked_at is null`
    expect(new Set(rows.map(r => r.id)).size).toBe(rows.length)
    expect(rows.length).toBeGreaterThanOrEqual(3)
  })
})

describe('sign-in rate limit (counters in PostgreSQL)', () => {
  it('locks an e-mail after 5 failures, even for the right password, and says when to retry', async () => {
    const { email } = await signUp('ratelimit')
    for (let i = 0; i < 5; i++) {
      const ip = `203.0.113.${10 + i}` // different addresses: the per-e-mail counter alone trips
      expect((await new Client(ip).post('/api/session', { email, password: 'wrong-password-x' })).status).toBe(401)
    }
    const locked = await new Client('203.0.113.99').post('/api/session', { email, password: goodPassword })
    expect(locked.status).toBe(429)
    expect(Number(locked.headers.get('retry-after'))).toBeGreaterThan(0)
    const [row] = await sql`select failures from sign_in_attempts where key = ${`email:${email}`}`
    expect(row!.failures).toBe(5)
  })

  it('locks a client address after too many failures across e-mails', async () => {
    const ip = '192.0.2.44'
    let last = 0
    for (let i = 0; i < 31; i++) last = (await new Client(ip).post('/api/session', { email: uniqueEmail('spray'), password: 'wrong-password-x' })).status
    expect(last).toBe(429)
    const { email } = await signUp('other-ip')
    expect((await new Client('192.0.2.45').post('/api/session', { email, password: goodPassword })).status).toBe(200)
  })

  it('a successful sign-in clears the e-mail counter', async () => {
    const { email } = await signUp('clears')
    for (let i = 0; i < 3; i++) await new Client(`198.18.0.${i}`).post('/api/session', { email, password: 'wrong-password-x' })
    expect((await new Client('198.18.0.9').post('/api/session', { email, password: goodPassword })).status).toBe(200)
    const rows = await sql`select 1 from sign_in_attempts where key = ${`email:${email}`}`
    expect(rows.length).toBe(0)
  })
})

describe('account', () => {
  it('changes the password only with the current one', async () => {
    const { client, email } = await signUp('pwchange')
    const wrong = await client.post('/api/account/password', { currentPassword: 'nope-nope-nope', newPassword: 'another-long-password' })
    expect(wrong.status).toBe(400)
    expect(wrong.body.data.fields.currentPassword).toBeTruthy()
    expect((await client.post('/api/account/password', { currentPassword: goodPassword, newPassword: 'another-long-password' })).status).toBe(200)
    expect((await new Client().post('/api/session', { email, password: 'another-long-password' })).status).toBe(200)
  })

  it('stores unit preferences and refuses unknown units', async () => {
    const { client } = await signUp('prefs')
    const ok = await client.patch('/api/account', { preferences: { pressure: 'psi', temperature: 'F' } })
    expect(ok.body.preferences).toEqual({ length: 'mm', volume: 'L', temperature: 'F', pressure: 'psi' })
    const bad = await client.patch('/api/account', { preferences: { pressure: 'atm' } })
    expect(bad.status).toBe(400)
    expect((await client.get('/api/session')).body.preferences.pressure).toBe('psi')
  })
})
