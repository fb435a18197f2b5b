import { afterAll, describe, expect, it } from 'vitest'
import { createHash, randomBytes } from 'node:crypto'
import { Client, addMember, baseUrl, goodPassword, signUp, uniqueEmail } from '../helpers/http'
import { linkFrom, tokenOf, waitForMail } from '../helpers/mail'
import { sql } from '../helpers/db'

// Invitations are the only way into a workshop: the owner names an address and a role, the link
// arrives by e-mail (read back from the fake SMTP server), and following it creates or links the
// account. Every token here comes out of a received message, never out of the API.

afterAll(() => sql.end())

const anonymous = () => new Client(`10.250.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}`)
const sha256 = (text: string) => createHash('sha256').update(text).digest('hex')

async function invite(owner: Client, email: string, role = 'reviewer', name?: string) {
  const res = await owner.post('/api/members', { email, role, ...(name ? { name } : {}) })
  expect(res.status).toBe(201)
  const mail = await waitForMail(email, { subject: 'Join ' })
  const link = linkFrom(mail, '/invite/')
  return { id: res.body.id as string, mail, link, token: tokenOf(link) }
}

describe('invitations', () => {
  it('arrive by e-mail; the link signs a new person up into the workshop with the invited role', async () => {
    const { client: owner, summary } = await signUp('inviter', 'Harrow Lane Garage')
    const project = await owner.post('/api/projects', { title: 'Roadster with a rotary swap' })
    const email = uniqueEmail('invitee')
    const { id, mail, link, token } = await invite(owner, email, 'reviewer', 'Ines Harrow')

    expect(mail.subject).toContain('Harrow Lane Garage')
    expect(mail.text).toContain('Ines Harrow')
    expect(link.origin).toBe(new URL(baseUrl).origin)
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/)
    // only the hash of the token is stored
    const [row] = await sql`select token_hash, accepted_at from invitations where id = ${id}`
    expect(row!.token_hash).toBe(sha256(token))
    expect(JSON.stringify(await owner.get('/api/invitations'))).not.toContain(token)

    // the page the link opens renders on the server with the workshop and role
    const page = await fetch(link)
    expect(page.status).toBe(200)
    const html = await page.text()
    expect(html).toContain('Harrow Lane Garage')
    expect(html).toContain('Reviewer')

    const newcomer = anonymous()
    const view = await newcomer.get(`/api/invitations/token/${token}`)
    expect(view.status).toBe(200)
    expect(view.body).toMatchObject({ workshop: { name: 'Harrow Lane Garage' }, role: 'reviewer', email, account: 'new', signedInAs: null, name: 'Ines Harrow' })

    const weak = await newcomer.post(`/api/invitations/token/${token}/accept`, { name: 'Ines Harrow', password: 'short' })
    expect(weak.status).toBe(400)
    expect(weak.body.data.fields.password).toBeTruthy()

    const accepted = await newcomer.post(`/api/invitations/token/${token}/accept`, { name: 'Ines H.', password: goodPassword })
    expect(accepted.status).toBe(200)
    expect(accepted.body.workshop).toMatchObject({ id: summary.workshop.id, name: 'Harrow Lane Garage' })
    expect(accepted.body.role).toBe('reviewer')
    expect(accepted.body.user).toMatchObject({ email, name: 'Ines H.', mustChangePassword: false })
    const projects = await newcomer.get('/api/projects')
    expect(projects.body.items.map((p: any) => p.id)).toContain(project.body.id)
    expect((await newcomer.post('/api/projects', { title: 'not for reviewers' })).status).toBe(403)
    // the chosen password is theirs
    expect((await anonymous().post('/api/session', { email, password: goodPassword })).status).toBe(200)

    const [membership] = await sql`select m.role from memberships m join users u on u.id = m.user_id where u.email = ${email} and m.workshop_id = ${summary.workshop.id}`
    expect(membership!.role).toBe('reviewer')
    expect((await sql`select accepted_at from invitations where id = ${id}`)[0]!.accepted_at).not.toBeNull()
    expect((await owner.get('/api/invitations')).body.invitations).toHaveLength(0)
    expect((await owner.get('/api/members')).body.map((m: any) => m.email)).toContain(email)

    // a token works once
    const again = await anonymous().post(`/api/invitations/token/${token}/accept`, { name: 'Someone Else', password: goodPassword })
    expect(again.status).toBe(410)
    expect(again.body.data.reason).toBe('used')
    expect((await anonymous().get(`/api/invitations/token/${token}`)).status).toBe(410)
  })

  it('an existing account accepts by signing in, and only then is the membership linked', async () => {
    const a = await signUp('shop-a', 'Shop A')
    const b = await signUp('shop-b', 'Shop B')
    const { token } = await invite(a.client, b.email, 'reviewer')
    // nobody joins before following the link
    expect((await b.client.get('/api/workshops')).body).toHaveLength(1)

    const visitor = anonymous()
    expect((await visitor.get(`/api/invitations/token/${token}`)).body.account).toBe('existing')
    const wrong = await visitor.post(`/api/invitations/token/${token}/accept`, { password: 'not-the-password' })
    expect(wrong.status).toBe(400)
    expect(wrong.body.data.fields.password).toBeTruthy()
    const accepted = await visitor.post(`/api/invitations/token/${token}/accept`, { password: goodPassword })
    expect(accepted.status).toBe(200)
    expect(accepted.body.workshop.name).toBe('Shop A')
    expect(accepted.body.role).toBe('reviewer')

    const workshops = await b.client.get('/api/workshops')
    expect(workshops.body.map((w: any) => `${w.name}:${w.role}`).sort()).toEqual(['Shop A:reviewer', 'Shop B:owner'])
    const shopA = workshops.body.find((w: any) => w.name === 'Shop A')
    expect((await b.client.post(`/api/workshops/${shopA.id}/switch`)).body.role).toBe('reviewer')
    expect((await b.client.post('/api/projects', { title: 'x' })).status).toBe(403)

    // a member already: refused with a field message, no invitation made
    const twice = await a.client.post('/api/members', { email: b.email, role: 'owner' })
    expect(twice.status).toBe(400)
    expect(twice.body.data.fields.email).toMatch(/already a member/)
  })

  it('signed in as the invited address it is one step; signed in as someone else it says so', async () => {
    const owner = (await signUp('one-step')).client
    const invitee = await signUp('one-step-invitee', 'Own Shop')
    const { token } = await invite(owner, invitee.email, 'technician')
    expect((await invitee.client.get(`/api/invitations/token/${token}`)).body.signedInAs).toBe(invitee.email)
    const joined = await invitee.client.post(`/api/invitations/token/${token}/accept`, {})
    expect(joined.status).toBe(200)
    expect(joined.body.role).toBe('technician')
    expect((await invitee.client.get('/api/session')).body.role).toBe('technician')

    const other = uniqueEmail('meant-for-other')
    const second = await invite(owner, other, 'fabricator')
    const view = await invitee.client.get(`/api/invitations/token/${second.token}`)
    expect(view.body).toMatchObject({ email: other, signedInAs: invitee.email })
    const refused = await invitee.client.post(`/api/invitations/token/${second.token}/accept`, {})
    expect(refused.status).toBe(403)
    expect(refused.body.message).toContain(other)
    expect(refused.body.message).toContain(invitee.email)
    expect((await sql`select accepted_at from invitations where id = ${second.id}`)[0]!.accepted_at).toBeNull()
  })

  it('expired, withdrawn and replaced links are refused with a plain message', async () => {
    const owner = (await signUp('closing')).client
    const expired = await invite(owner, uniqueEmail('late'))
    await sql`update invitations set expires_at = now() - interval '1 minute' where id = ${expired.id}`
    const view = await anonymous().get(`/api/invitations/token/${expired.token}`)
    expect(view.status).toBe(410)
    expect(view.body.data.reason).toBe('expired')
    expect(view.body.message).toMatch(/expired/)
    expect((await anonymous().post(`/api/invitations/token/${expired.token}/accept`, { name: 'Late', password: goodPassword })).status).toBe(410)
    expect((await fetch(expired.link)).status).toBe(410)
    // the owner still sees it, marked expired, and can send a fresh one
    const listed = (await owner.get('/api/invitations')).body.invitations.find((i: any) => i.id === expired.id)
    expect(listed.expired).toBe(true)

    const revoked = await invite(owner, uniqueEmail('withdrawn'))
    expect((await owner.delete(`/api/invitations/${revoked.id}`)).status).toBe(200)
    const gone = await anonymous().post(`/api/invitations/token/${revoked.token}/accept`, { name: 'Withdrawn', password: goodPassword })
    expect(gone.status).toBe(410)
    expect(gone.body.data.reason).toBe('revoked')
    expect((await owner.delete(`/api/invitations/${revoked.id}`)).status).toBe(404)

    const email = uniqueEmail('resent')
    const first = await invite(owner, email)
    const before = (await sql`select count(*)::int as n from mail_outbox where to_address = ${email}`)[0]!.n
    expect((await owner.post(`/api/invitations/${first.id}/resend`)).status).toBe(200)
    const mail = await waitForMail(email, { subject: 'Join ', after: before })
    const token = tokenOf(linkFrom(mail, '/invite/'))
    expect(token).not.toBe(first.token)
    expect((await anonymous().get(`/api/invitations/token/${first.token}`)).status).toBe(404)
    expect((await anonymous().post(`/api/invitations/token/${token}/accept`, { name: 'Resent', password: goodPassword })).status).toBe(200)

    expect((await anonymous().get(`/api/invitations/token/${randomBytes(32).toString('base64url')}`)).status).toBe(404)
    expect((await anonymous().get('/api/invitations/token/not-a-token')).status).toBe(404)
  })

  it('two people opening the same link at once: exactly one gets in', async () => {
    const owner = (await signUp('race-invite')).client
    const email = uniqueEmail('raced')
    const { token } = await invite(owner, email, 'fabricator')
    const results = await Promise.all([anonymous(), anonymous()].map(c =>
      c.post(`/api/invitations/token/${token}/accept`, { name: 'Raced', password: goodPassword })))
    expect(results.map(r => r.status).sort()).toEqual([200, 410])
    expect((await sql`select count(*)::int as n from users where email = ${email}`)[0]!.n).toBe(1)
  })

  it('only owners invite, and another workshop\'s invitations are out of reach', async () => {
    const { client: owner } = await signUp('guarded')
    const fab = await addMember(owner, 'fabricator')
    expect((await fab.client.post('/api/members', { email: uniqueEmail('x'), role: 'owner' })).status).toBe(403)
    expect((await fab.client.get('/api/invitations')).status).toBe(403)
    const open = await invite(owner, uniqueEmail('guarded-invitee'))
    const stranger = (await signUp('guarded-stranger')).client
    expect((await stranger.delete(`/api/invitations/${open.id}`)).status).toBe(404)
    expect((await stranger.post(`/api/invitations/${open.id}/resend`)).status).toBe(404)
    expect((await new Client().get('/api/invitations')).status).toBe(401)
    const bad = await owner.post('/api/members', { email: 'not-an-address', role: 'boss' })
    expect(bad.status).toBe(400)
    expect(Object.keys(bad.body.data.fields).sort()).toEqual(['email', 'role'])
  })
})
