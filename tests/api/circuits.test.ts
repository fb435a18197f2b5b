import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { Client, addMember, signUp } from '../helpers/http'
import { sql } from '../helpers/db'

afterAll(() => sql.end())

let owner: Client
let projectId: string
beforeAll(async () => {
  owner = (await signUp('circuits')).client
  projectId = (await owner.post('/api/projects', { title: 'Circuit host' })).body.id
})

describe('circuits of a project', () => {
  it('creates coolant and fuel circuits side by side and lists them', async () => {
    const coolant = await owner.post(`/api/projects/${projectId}/circuits`, { kind: 'coolant', title: 'Engine cooling' })
    const fuel = await owner.post(`/api/projects/${projectId}/circuits`, { kind: 'fuel', title: 'Injection feed' })
    expect(coolant.status).toBe(201)
    expect(coolant.body.version).toBe(1)
    expect(fuel.body.kind).toBe('fuel')
    const list = await owner.get(`/api/projects/${projectId}/circuits`)
    expect(list.body.map((c: any) => c.title)).toEqual(['Engine cooling', 'Injection feed'])
    expect((await owner.post(`/api/projects/${projectId}/circuits`, { kind: 'steam', title: 'x' })).status).toBe(400)
  })

  it('renames, and deletes only when the title is typed exactly', async () => {
    const created = await owner.post(`/api/projects/${projectId}/circuits`, { kind: 'coolant', title: 'Heater loop' })
    const id = created.body.id
    expect((await owner.patch(`/api/circuits/${id}`, { title: 'Cabin heater loop' })).body.title).toBe('Cabin heater loop')
    const refused = await owner.delete(`/api/circuits/${id}`, { confirmTitle: 'Heater loop' })
    expect(refused.status).toBe(400)
    expect(refused.body.data.fields.confirmTitle).toMatch(/Cabin heater loop/)
    expect((await sql`select 1 from circuits where id = ${id}`).length).toBe(1)
    expect((await owner.delete(`/api/circuits/${id}`, { confirmTitle: 'Cabin heater loop' })).status).toBe(200)
    expect((await owner.get(`/api/circuits/${id}`)).status).toBe(404)
  })

  it('keeps other workshops and read-only roles out', async () => {
    const created = await owner.post(`/api/projects/${projectId}/circuits`, { kind: 'coolant', title: 'Guarded' })
    const id = created.body.id
    const stranger = (await signUp('circuit-stranger')).client
    expect((await stranger.get(`/api/circuits/${id}`)).status).toBe(404)
    expect((await stranger.patch(`/api/circuits/${id}`, { title: 'x' })).status).toBe(404)
    expect((await stranger.delete(`/api/circuits/${id}`, { confirmTitle: 'Guarded' })).status).toBe(404)
    const { client: reviewer } = await addMember(owner, 'reviewer')
    expect((await reviewer.get(`/api/circuits/${id}`)).status).toBe(200)
    expect((await reviewer.delete(`/api/circuits/${id}`, { confirmTitle: 'Guarded' })).status).toBe(403)
    expect((await sql`select title from circuits where id = ${id}`)[0]!.title).toBe('Guarded')
  })
})
