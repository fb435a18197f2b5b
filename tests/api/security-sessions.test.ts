import { afterAll, describe, expect, it } from 'vitest'
import { createHash } from 'node:crypto'
import { Client, goodPassword, signUp, uniqueEmail } from '../helpers/http'
import { linkFrom, tokenOf, waitForMail } from '../helpers/mail'
import { sql } from '../helpers/db'

// Sessions and passwords, one rule per test, with where the rule comes from. ASVS numbers are
// OWASP ASVS 4.0.3 and quoted from memory; NIST SP 800-63B likewise. Related checks elsewhere:
// tests/api/auth.test.ts (sign-in limits, copied cookie after sign-out, expiry) and
// tests/api/password-reset.test.ts (the whole reset flow).
afterAll(() => sql.end())

const visitor = () => new Client(`10.252.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}`)
const sessionCookie = (c: Client) => c.cookies.get('nuxt-session')

describe('sessions', () => {
  it('a session id planted before sign-in is not adopted (ASVS V3.2.1: new token on authentication)', async () => {
    const { email: victimEmail, summary: victim } = await signUp('fixation-victim')
    // the attacker's own valid session, and a made-up value, both planted in the victim's browser
    const { client: attacker } = await signUp('fixation-attacker')
    for (const planted of [sessionCookie(attacker)!, 'Fe26.2**planted-by-someone-else']) {
      const browser = visitor()
      browser.cookies.set('nuxt-session', planted)
      expect((await browser.post('/api/session', { email: victimEmail, password: goodPassword })).status).toBe(200)
      expect(sessionCookie(browser)).not.toBe(planted)
      expect((await browser.get('/api/session')).body.user.id).toBe(victim.user.id)
      // whoever holds the planted value is not signed in as the victim
      const holder = visitor()
      holder.cookies.set('nuxt-session', planted)
      expect((await holder.get('/api/session')).body.user?.id).not.toBe(victim.user.id)
    }
  })

  it('sign-out ends the session on the server, for every copy of the cookie (ASVS V3.3.1)', async () => {
    const { client, summary } = await signUp('logout')
    const copy = visitor()
    copy.cookies = new Map(client.cookies)
    expect((await client.delete('/api/session')).status).toBe(200)
    expect((await copy.get('/api/projects')).status).toBe(401)
    const rows = await sql`select revoked_at from auth_sessions where user_id = ${summary.user.id}`
    expect(rows.length).toBe(1)
    expect(rows[0]!.revoked_at).not.toBeNull()
  })

  it('a session past its end is refused even with a well-sealed cookie (ASVS V3.3.1)', async () => {
    const { client, summary } = await signUp('session-end')
    await sql`update auth_sessions set expires_at = now() - interval '1 second' where user_id = ${summary.user.id}`
    expect((await client.get('/api/projects')).status).toBe(401)
  })

  it('a tampered cookie is no session at all (ASVS V3.5.x, from memory: tokens are integrity-protected)', async () => {
    const { client } = await signUp('tamper')
    const cookie = sessionCookie(client)!
    const tampered = visitor()
    tampered.cookies.set('nuxt-session', cookie.slice(0, -4) + (cookie.endsWith('AAAA') ? 'BBBB' : 'AAAA'))
    expect((await tampered.get('/api/projects')).status).toBe(401)
  })
})

describe('passwords', () => {
  // NIST SP 800-63B §5.1.1.2 (from memory) asks at least 8 characters and allows long passphrases;
  // ASVS V2.1.1 asks 12. Ours: at least 10, at most 200, not padded with spaces, not one repeated character.
  it.each([
    ['nine-char', 'too short (fewer than 10)'],
    ['aaaaaaaaaaaaaaaa', 'too repetitive (fewer than 4 different characters)'],
    [' spaced-password ', 'starts or ends with a space'],
    ['x'.repeat(150) + 'y'.repeat(51), 'longer than 200'],
  ])('refuses %j: %s', async (password) => {
    const res = await new Client().post('/api/account', { name: 'Weak', email: uniqueEmail('weak'), password, workshopName: 'Weak shop' })
    expect(res.status).toBe(400)
    expect(res.body.data.fields.password).toBeTruthy()
  })

  it('accepts a long passphrase with spaces inside (ASVS V2.1.3: no truncation, spaces allowed)', async () => {
    const passphrase = 'coolant goes in the top hose, air comes out the bleed screw'
    const email = uniqueEmail('passphrase')
    expect((await new Client().post('/api/account', { name: 'Long', email, password: passphrase, workshopName: 'Long shop' })).status).toBe(201)
    expect((await visitor().post('/api/session', { email, password: passphrase })).status).toBe(200)
    expect((await visitor().post('/api/session', { email, password: passphrase.slice(0, -1) })).status).toBe(401)
  })

  it('stores only a salted, slow hash (ASVS V2.4.1)', async () => {
    const { email } = await signUp('hash')
    const [row] = await sql`select password_hash from users where email = ${email}`
    expect(row!.password_hash).not.toContain(goodPassword)
    // nuxt-auth-utils hashes with scrypt: "$scrypt$" with its cost parameters and salt
    expect(row!.password_hash).toMatch(/^\$scrypt\$/)
  })
})

describe('password-reset links', () => {
  async function resetLink(email: string) {
    expect((await visitor().post('/api/password-resets', { email })).status).toBe(202)
    return tokenOf(linkFrom(await waitForMail(email, { subject: 'Reset' }), '/reset-password/'))
  }

  it('the token is random, stored only as its SHA-256, and single use (OWASP Forgot Password Cheat Sheet, from memory)', async () => {
    const { email } = await signUp('reset-token')
    const token = await resetLink(email)
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/) // 32 random bytes
    const stored = await sql`select token_hash from password_resets r join users u on u.id = r.user_id where u.email = ${email}`
    expect(stored.map(r => r.token_hash)).toEqual([createHash('sha256').update(token).digest('hex')])
    expect((await visitor().post(`/api/password-resets/${token}/complete`, { password: 'a-fresh-password-1' })).status).toBe(200)
    expect((await visitor().post(`/api/password-resets/${token}/complete`, { password: 'a-fresh-password-2' })).status).toBe(410)
  })

  it('expires: HOSEWRIGHT_RESET_MINUTES (60) after it was sent the link answers 410', async () => {
    const { email } = await signUp('reset-expiry')
    const token = await resetLink(email)
    const [row] = await sql`select extract(epoch from (expires_at - created_at))::int as seconds from password_resets where token_hash = ${createHash('sha256').update(token).digest('hex')}`
    expect(row!.seconds).toBe(3600)
    await sql`update password_resets set expires_at = now() - interval '1 second' where token_hash = ${createHash('sha256').update(token).digest('hex')}`
    expect((await visitor().post(`/api/password-resets/${token}/complete`, { password: 'a-fresh-password-3' })).status).toBe(410)
  })
})
