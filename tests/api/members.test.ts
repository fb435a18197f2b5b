import { afterAll, describe, expect, it } from 'vitest'
import { Client, addMember, signUp } from '../helpers/http'
import { sql } from '../helpers/db'
import { linkFrom, tokenOf, waitForMail } from '../helpers/mail'

afterAll(() => sql.end())

describe('members (owner only)', () => {
  it('adds a new person by invitation: they choose their own password', async () => {
    const { client: owner } = await signUp('members')
    const { client: tech, email, password } = await addMember(owner, 'technician')
    const me = await tech.get('/api/session')
    expect(me.body.user).toMatchObject({ email, mustChangePassword: false })
    expect(me.body.role).toBe('technician')
    expect((await new Client().post('/api/session', { email, password })).status).toBe(200)
    const list = await owner.get('/api/members')
    expect(list.body.map((m: any) => m.role).sort()).toEqual(['owner', 'technician'])
  })

  it('links an existing account to a second workshop once they accept, and the user switches between them', async () => {
    const a = await signUp('shop-a', 'Shop A')
    const b = await signUp('shop-b', 'Shop B')
    const added = await a.client.post('/api/members', { email: b.email, role: 'reviewer' })
    expect(added.status).toBe(201)
    const token = tokenOf(linkFrom(await waitForMail(b.email, { subject: 'Join ' }), '/invite/'))
    expect((await b.client.post(`/api/invitations/token/${token}/accept`, {})).status).toBe(200)
    const workshops = await b.client.get('/api/workshops')
    expect(workshops.body.map((w: any) => `${w.name}:${w.role}`).sort()).toEqual(['Shop A:reviewer', 'Shop B:owner'])
    const shopA = workshops.body.find((w: any) => w.name === 'Shop A')
    const switched = await b.client.post(`/api/workshops/${shopA.id}/switch`)
    expect(switched.body.role).toBe('reviewer')
    expect((await b.client.post('/api/projects', { title: 'x' })).status).toBe(403)
    expect((await b.client.post(`/api/workshops/${(await a.client.get('/api/session')).body.user.id}/switch`)).status).toBe(404)
    expect((await a.client.post('/api/members', { email: b.email, role: 'owner' })).status).toBe(400)
  })

  it('changes roles, and never leaves a workshop without an owner', async () => {
    const { client: owner, summary } = await signUp('lastowner')
    const list = await owner.get('/api/members')
    const self = list.body.find((m: any) => m.userId === summary.user.id)
    const demote = await owner.patch(`/api/members/${self.id}`, { role: 'fabricator' })
    expect(demote.status).toBe(409)
    expect((await owner.delete(`/api/members/${self.id}`)).status).toBe(409)
    const second = await addMember(owner, 'owner', 'second-owner')
    expect((await owner.patch(`/api/members/${self.id}`, { role: 'fabricator' })).status).toBe(200)
    // now only the second owner is owner: they cannot step down
    expect((await second.client.patch(`/api/members/${second.membershipId}`, { role: 'reviewer' })).status).toBe(409)
    const owners = await sql`select count(*)::int as n from memberships where workshop_id = ${summary.workshop.id} and role = 'owner'`
    expect(owners[0]!.n).toBe(1)
  })

  it('two owners demoting each other at once: exactly one succeeds', async () => {
    const { client: owner, summary } = await signUp('race')
    const other = await addMember(owner, 'owner', 'race-other')
    const self = (await owner.get('/api/members')).body.find((m: any) => m.userId === summary.user.id)
    const results = await Promise.all([
      owner.patch(`/api/members/${other.membershipId}`, { role: 'fabricator' }),
      other.client.patch(`/api/members/${self.id}`, { role: 'fabricator' }),
    ])
    // the loser is refused either by the owner check (409) or, if it ran later, by its lost role (403)
    expect(results.filter(r => r.status === 200)).toHaveLength(1)
    expect(results.filter(r => r.status !== 200).map(r => r.status)[0]).toBeOneOf([403, 409])
    const owners = await sql`select count(*)::int as n from memberships where workshop_id = ${summary.workshop.id} and role = 'owner'`
    expect(owners[0]!.n).toBe(1)
  })

  it('is closed to other roles and to other workshops', async () => {
    const { client: owner } = await signUp('members-guard')
    const fab = await addMember(owner, 'fabricator')
    expect((await fab.client.get('/api/members')).status).toBe(403)
    expect((await fab.client.post('/api/members', { email: 'x@example.test', role: 'owner' })).status).toBe(403)
    const stranger = (await signUp('members-stranger')).client
    expect((await stranger.patch(`/api/members/${fab.membershipId}`, { role: 'owner' })).status).toBe(404)
    expect((await stranger.delete(`/api/members/${fab.membershipId}`)).status).toBe(404)
    expect((await new Client().get('/api/members')).status).toBe(401)
  })

  it('a removed member loses access to that workshop at once', async () => {
    const { client: owner } = await signUp('removal')
    const fab = await addMember(owner, 'fabricator')
    const project = await owner.post('/api/projects', { title: 'Soon out of reach' })
    expect((await fab.client.get(`/api/projects/${project.body.id}`)).status).toBe(200)
    expect((await owner.delete(`/api/members/${fab.membershipId}`)).status).toBe(200)
    expect((await fab.client.get(`/api/projects/${project.body.id}`)).status).toBe(403)
  })
})
