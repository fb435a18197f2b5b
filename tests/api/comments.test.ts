import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { demoDocument } from '#shared/demo'
import { Client, addMember, signUp } from '../helpers/http'
import { waitForMail, linkFrom, mailTo } from '../helpers/mail'
import { sql } from '../helpers/db'

// Comments pinned to parts, hoses and points: threads, resolve and reopen, editing and deleting
// one's own, and @mentions that reach the person by e-mail.
afterAll(() => sql.end())

let owner: Client
let fab: Client
let rev: Client
let tech: Client
let emails: { rev: string; tech: string; fab: string }
let ids: { fab: string; rev: string; tech: string }
let circuitId: string

beforeAll(async () => {
  owner = (await signUp('cmowner', 'Comment shop')).client
  const [f, r, t] = await Promise.all([addMember(owner, 'fabricator', 'cmfab'), addMember(owner, 'reviewer', 'cmrev'), addMember(owner, 'technician', 'cmtech')])
  fab = f.client; rev = r.client; tech = t.client
  emails = { fab: f.email, rev: r.email, tech: t.email }
  const projectId = (await fab.post('/api/projects', { title: 'Comment build' })).body.id
  circuitId = (await fab.post(`/api/projects/${projectId}/circuits`, { kind: 'coolant', title: 'Comment cooling' })).body.id
  const doc = demoDocument()
  doc.circuit.title = 'Comment cooling'
  expect((await fab.put(`/api/circuits/${circuitId}/graph`, { baseVersion: 1, document: doc })).status).toBe(200)
  const people = (await tech.get(`/api/circuits/${circuitId}/comments/people`)).body.people
  const idOf = (name: string) => people.find((p: any) => p.name === name).id
  ids = { fab: idOf('Test cmfab'), rev: idOf('Test cmrev'), tech: idOf('Test cmtech') }
})

describe('comments on a circuit', () => {
  let thread: string

  it('a thread pinned to a part mentions the reviewer, who gets an e-mail with a link', async () => {
    const res = await fab.post(`/api/circuits/${circuitId}/comments`, {
      body: '@Test cmrev is the third outlet meant to stay open?', version: 2, anchor: { kind: 'component', elementId: 'engine' },
    })
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({ parentId: null, version: 2, anchor: { kind: 'component', elementId: 'engine' }, mentions: [ids.rev], author: { id: ids.fab } })
    thread = res.body.id
    const queued = await sql`select to_address from mail_outbox where kind = 'mention' and text_body like ${`%comment=${thread}%`}`
    expect(queued.map(r => r.to_address)).toEqual([emails.rev])
    const mail = await waitForMail(emails.rev, { subject: 'mentioned you on Comment cooling' })
    expect(mail.text).toContain('is the third outlet meant to stay open?')
    expect(linkFrom(mail, '/circuits/').searchParams.get('comment')).toBe(thread)
  })

  it('hoses and free points can be pinned too; a missing element, version or body is refused', async () => {
    const hose = await rev.post(`/api/circuits/${circuitId}/comments`, { body: 'Support this run every 400 mm', version: 2, anchor: { kind: 'hose', elementId: 'hose-top' } })
    expect(hose.status).toBe(201)
    const point = await tech.post(`/api/circuits/${circuitId}/comments`, { body: 'Heat shield goes here', version: 2, anchor: { kind: 'point', point: { x: 3000, y: 100, z: 0 }, view: 'top' } })
    expect(point.status).toBe(201)
    const missing = await rev.post(`/api/circuits/${circuitId}/comments`, { body: 'Where?', version: 2, anchor: { kind: 'component', elementId: 'heater-bleed' } })
    expect(missing.status).toBe(400)
    expect(missing.body.data.fields['anchor.elementId']).toMatch(/no such part/)
    const noVersion = await rev.post(`/api/circuits/${circuitId}/comments`, { body: 'Later', version: 9 })
    expect(noVersion.status).toBe(400)
    expect(noVersion.body.data.fields.version).toBeTruthy()
    const empty = await rev.post(`/api/circuits/${circuitId}/comments`, { body: '   ', version: 2 })
    expect(empty.status).toBe(400)
    expect(empty.body.data.fields.body).toBeTruthy()
  })

  it('replies join the thread (a reply to a reply too) and threads resolve and reopen', async () => {
    const reply = await rev.post(`/api/circuits/${circuitId}/comments`, { body: 'No, it needs a cap.', version: 2, parentId: thread })
    expect(reply.body.parentId).toBe(thread)
    const nested = await fab.post(`/api/circuits/${circuitId}/comments`, { body: 'Cap ordered.', version: 2, parentId: reply.body.id })
    expect(nested.body.parentId).toBe(thread)
    expect((await rev.post(`/api/comments/${reply.body.id}/resolve`)).status).toBe(400)
    const resolved = await rev.post(`/api/comments/${thread}/resolve`)
    expect(resolved.body).toMatchObject({ resolvedBy: { id: ids.rev } })
    expect(resolved.body.resolvedAt).toBeTruthy()
    const reopened = await tech.post(`/api/comments/${thread}/reopen`)
    expect(reopened.body).toMatchObject({ resolvedAt: null, resolvedBy: null })
    const list = (await tech.get(`/api/circuits/${circuitId}/comments`)).body.comments
    expect(list.filter((c: any) => c.parentId === thread).map((c: any) => c.body)).toEqual(['No, it needs a cap.', 'Cap ordered.'])
  })

  it('the author edits their own comment; people newly mentioned get the e-mail, others not again', async () => {
    const before = (await mailTo(emails.rev)).length
    const techBefore = (await mailTo(emails.tech)).length
    expect((await rev.patch(`/api/comments/${thread}`, { body: 'Hijacked' })).status).toBe(403)
    const edited = await fab.patch(`/api/comments/${thread}`, { body: '@Test cmrev @Test cmtech is the third outlet meant to stay open?' })
    expect(edited.status).toBe(200)
    expect(edited.body.editedAt).toBeTruthy()
    expect(edited.body.mentions).toEqual([ids.rev, ids.tech])
    await waitForMail(emails.tech, { subject: 'mentioned you', after: techBefore })
    const queuedForRev = await sql`select count(*)::int as n from mail_outbox where kind = 'mention' and to_address = ${emails.rev}`
    expect(queuedForRev[0]!.n).toBe(1)
    expect((await mailTo(emails.rev)).length).toBe(before)
  })

  it('deleting keeps a thread readable: a first comment with replies becomes a placeholder', async () => {
    expect((await tech.delete(`/api/comments/${thread}`)).status).toBe(403)
    expect((await fab.delete(`/api/comments/${thread}`)).status).toBe(200)
    let list = (await rev.get(`/api/circuits/${circuitId}/comments`)).body.comments
    expect(list.find((c: any) => c.id === thread)).toMatchObject({ deleted: true, body: '', mentions: [] })
    // the replies go one by one (the owner may remove anyone's); the last takes the placeholder along
    for (const r of list.filter((c: any) => c.parentId === thread)) expect((await owner.delete(`/api/comments/${r.id}`)).status).toBe(200)
    list = (await rev.get(`/api/circuits/${circuitId}/comments`)).body.comments
    expect(list.find((c: any) => c.id === thread || c.parentId === thread)).toBeUndefined()
    expect((await fab.patch(`/api/comments/${thread}`, { body: 'Back?' })).status).toBe(404)
  })

  it('each step is in the project’s activity log', async () => {
    const rows = await sql`select action from activity where circuit_id = ${circuitId} and action like 'comment.%' order by created_at`
    const actions = rows.map(r => r.action)
    expect(actions.filter(a => a === 'comment.added')).toHaveLength(5)
    expect(actions).toContain('comment.resolved')
    expect(actions).toContain('comment.reopened')
  })
})
