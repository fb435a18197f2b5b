import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { Client, addMember, signUp } from '../helpers/http'
import { sql } from '../helpers/db'

afterAll(() => sql.end())

let owner: Client
beforeAll(async () => {
  owner = (await signUp('projects')).client
  const rows = [
    { title: 'Alpha wagon', vehicle: 'Estate car', engine: 'Diesel six', dueDate: '2027-05-01', status: 'planning' },
    { title: 'Bravo pickup', vehicle: 'Pickup truck', engine: 'Petrol V8', dueDate: null, status: 'fabrication' },
    { title: 'Charlie roadster', vehicle: 'Two-seat roadster', engine: 'Turbo four', dueDate: '2027-01-15', status: 'review' },
  ]
  for (const row of rows) expect((await owner.post('/api/projects', row)).status).toBe(201)
})

describe('projects', () => {
  it('lists, searches and sorts the workshop\'s projects', async () => {
    const all = await owner.get('/api/projects?sort=title&dir=asc')
    expect(all.body.items.map((p: any) => p.title)).toEqual(['Alpha wagon', 'Bravo pickup', 'Charlie roadster'])
    expect(all.body.total).toBe(3)
    const byEngine = await owner.get('/api/projects?q=turbo')
    expect(byEngine.body.items.map((p: any) => p.title)).toEqual(['Charlie roadster'])
    const due = await owner.get('/api/projects?sort=dueDate&dir=asc')
    // no due date sorts last
    expect(due.body.items.map((p: any) => p.title)).toEqual(['Charlie roadster', 'Alpha wagon', 'Bravo pickup'])
    const review = await owner.get('/api/projects?status=review')
    expect(review.body.items).toHaveLength(1)
  })

  it('paginates without overlap', async () => {
    const p1 = await owner.get('/api/projects?pageSize=2&page=1&sort=title&dir=asc')
    const p2 = await owner.get('/api/projects?pageSize=2&page=2&sort=title&dir=asc')
    expect(p1.body.items).toHaveLength(2)
    expect(p2.body.items.map((p: any) => p.title)).toEqual(['Charlie roadster'])
  })

  it('treats search text literally (wildcards are not patterns)', async () => {
    const res = await owner.get('/api/projects?q=%25')
    expect(res.status).toBe(200)
    expect(res.body.items).toHaveLength(0)
  })

  it('rejects bad input with field messages and a bad query with 400', async () => {
    const res = await owner.post('/api/projects', { title: '   ', dueDate: '2027-02-30' })
    expect(res.status).toBe(400)
    expect(res.body.data.fields).toMatchObject({ title: expect.any(String), dueDate: expect.any(String) })
    expect((await owner.get('/api/projects?sort=password')).status).toBe(400)
    expect((await owner.get('/api/projects?pageSize=5000')).status).toBe(400)
  })

  it('updates, archives (hidden from the open list) and restores', async () => {
    const created = await owner.post('/api/projects', { title: 'Delta van' })
    const id = created.body.id
    const patched = await owner.patch(`/api/projects/${id}`, { notes: 'Heater core under the seat', dueDate: '2027-03-31' })
    expect(patched.body).toMatchObject({ title: 'Delta van', notes: 'Heater core under the seat', dueDate: '2027-03-31' })
    expect((await owner.patch(`/api/projects/${id}`, { status: 'archived' })).status).toBe(400)
    expect((await owner.post(`/api/projects/${id}/archive`)).body.status).toBe('archived')
    const open = await owner.get('/api/projects?q=Delta')
    expect(open.body.items).toHaveLength(0)
    const archived = await owner.get('/api/projects?q=Delta&status=archived')
    expect(archived.body.items).toHaveLength(1)
    expect((await owner.post(`/api/projects/${id}/restore`)).body.status).toBe('planning')
  })

  it('answers 404 for another workshop\'s project and for ids that are not ids', async () => {
    const other = (await signUp('intruder')).client
    const mine = await owner.post('/api/projects', { title: 'Private build' })
    expect((await other.get(`/api/projects/${mine.body.id}`)).status).toBe(404)
    expect((await other.patch(`/api/projects/${mine.body.id}`, { title: 'Hijacked' })).status).toBe(404)
    expect((await other.post(`/api/projects/${mine.body.id}/archive`)).status).toBe(404)
    expect((await other.get(`/api/projects/${mine.body.id}/circuits`)).status).toBe(404)
    expect((await other.post(`/api/projects/${mine.body.id}/circuits`, { kind: 'coolant', title: 'x' })).status).toBe(404)
    expect((await other.get('/api/projects')).body.items.map((p: any) => p.title)).not.toContain('Private build')
    expect((await owner.get('/api/projects/not-a-uuid')).status).toBe(404)
    const [row] = await sql`select title from projects where id = ${mine.body.id}`
    expect(row!.title).toBe('Private build')
  })

  it('lets reviewers and technicians read but not write', async () => {
    for (const role of ['reviewer', 'technician']) {
      const { client } = await addMember(owner, role)
      expect((await client.get('/api/projects')).status).toBe(200)
      const denied = await client.post('/api/projects', { title: 'Not mine to make' })
      expect(denied.status).toBe(403)
    }
    const [row] = await sql`select count(*)::int as n from projects where title = 'Not mine to make'`
    expect(row!.n).toBe(0)
  })

  it('refuses signed-out callers', async () => {
    expect((await new Client().get('/api/projects')).status).toBe(401)
    expect((await new Client().post('/api/projects', { title: 'x' })).status).toBe(401)
  })
})
