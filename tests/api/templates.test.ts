import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { demoDocument } from '#shared/demo'
import { templateFromComponent } from '#shared/schemas/template'
import { Client, addMember, signUp } from '../helpers/http'
import { sql } from '../helpers/db'

afterAll(() => sql.end())

// Bodies come from the demo drawing's own parts, the way "save as template" makes them.
const partBody = (id: string) => templateFromComponent(demoDocument().circuit.components.find(c => c.id === id)!)

let owner: Client
beforeAll(async () => {
  owner = (await signUp('templates')).client
})

describe('part templates of a workshop', () => {
  it('creates, reads, lists, renames, replaces and deletes', async () => {
    const created = await owner.post('/api/templates', { name: 'Inline thermostat 32 mm', body: partBody('thermostat') })
    expect(created.status).toBe(201)
    expect(created.body).toMatchObject({ name: 'Inline thermostat 32 mm', type: 'thermostat', body: partBody('thermostat') })
    const id = created.body.id
    const [row] = await sql`select type, body from part_templates where id = ${id}`
    expect(row!.type).toBe('thermostat')
    expect(row!.body).toEqual(partBody('thermostat'))

    expect((await owner.get(`/api/templates/${id}`)).body.name).toBe('Inline thermostat 32 mm')
    await owner.post('/api/templates', { name: 'Radiator, front', body: partBody('radiator') })
    const list = await owner.get('/api/templates')
    expect(list.body.map((t: any) => t.name)).toEqual(['Inline thermostat 32 mm', 'Radiator, front'])
    // search reaches names, part types and the part's own label
    expect((await owner.get('/api/templates?q=radiat')).body.map((t: any) => t.name)).toEqual(['Radiator, front'])
    expect((await owner.get('/api/templates?q=housing')).body.map((t: any) => t.name)).toEqual(['Inline thermostat 32 mm'])
    expect((await owner.get('/api/templates?q=%25')).body).toEqual([])

    const renamed = await owner.patch(`/api/templates/${id}`, { name: 'Thermostat, inline' })
    expect(renamed.status).toBe(200)
    expect(renamed.body.name).toBe('Thermostat, inline')
    const replaced = await owner.patch(`/api/templates/${id}`, { body: partBody('tank') })
    expect(replaced.body).toMatchObject({ name: 'Thermostat, inline', type: 'expansion-tank' })

    expect((await owner.delete(`/api/templates/${id}`)).status).toBe(200)
    expect((await owner.get(`/api/templates/${id}`)).status).toBe(404)
    expect((await owner.delete(`/api/templates/${id}`)).status).toBe(404)
  })

  it('names are unique per workshop whatever their case, and another workshop may reuse them', async () => {
    expect((await owner.post('/api/templates', { name: 'Heater tee 16', body: partBody('return-tee') })).status).toBe(201)
    const clash = await owner.post('/api/templates', { name: '  heater TEE 16 ', body: partBody('return-tee') })
    expect(clash.status).toBe(400)
    expect(clash.body.data.fields.name).toMatch(/already exists/)
    const other = await owner.post('/api/templates', { name: 'Heater tee 19', body: partBody('return-tee') })
    const renameClash = await owner.patch(`/api/templates/${other.body.id}`, { name: 'HEATER tee 16' })
    expect(renameClash.status).toBe(400)
    expect(renameClash.body.data.fields.name).toMatch(/already exists/)
    expect((await owner.get(`/api/templates/${other.body.id}`)).body.name).toBe('Heater tee 19')

    const elsewhere = (await signUp('templates-elsewhere')).client
    expect((await elsewhere.post('/api/templates', { name: 'Heater tee 16', body: partBody('return-tee') })).status).toBe(201)
  })

  it('bad bodies answer 400 with the path of each failing field', async () => {
    const body = partBody('thermostat') as any
    body.ports[0].spigotOdMm = -4
    body.volumeL = 'lots'
    const res = await owner.post('/api/templates', { name: '', body })
    expect(res.status).toBe(400)
    expect(Object.keys(res.body.data.fields).sort()).toEqual(['body.ports.0.spigotOdMm', 'body.volumeL', 'name'])

    const placed = { ...partBody('radiator'), id: 'radiator', position: { x: 0, y: 0, z: 0 } }
    expect(Object.keys((await owner.post('/api/templates', { name: 'Placed', body: placed })).body.data.fields)).toEqual(['body'])

    const stat = partBody('thermostat') as any
    stat.params.valvedPortId = 'nowhere'
    stat.ports[1].id = stat.ports[0].id
    const crossed = await owner.post('/api/templates', { name: 'Crossed', body: stat })
    expect(Object.keys(crossed.body.data.fields).sort()).toEqual(['body.params.valvedPortId', 'body.ports.1.id'])

    expect((await owner.post('/api/templates', { name: 'Unknown', body: { ...partBody('radiator'), type: 'flux-capacitor' } })).body.data.fields['body.type']).toBeTruthy()
    expect((await owner.patch('/api/templates/00000000-0000-4000-8000-000000000000', {})).status).toBe(400)
    expect((await sql`select count(*)::int as n from part_templates where name in ('Placed', 'Crossed', 'Unknown')`)[0]!.n).toBe(0)
  })

  it('another workshop cannot see or change a template; every role reads, only owners and fabricators write', async () => {
    const id = (await owner.post('/api/templates', { name: 'Shop drain tap', body: partBody('radiator') })).body.id
    const stranger = (await signUp('templates-stranger')).client
    expect((await stranger.get(`/api/templates/${id}`)).status).toBe(404)
    expect((await stranger.patch(`/api/templates/${id}`, { name: 'Mine now' })).status).toBe(404)
    expect((await stranger.delete(`/api/templates/${id}`)).status).toBe(404)
    expect((await stranger.get('/api/templates')).body.map((t: any) => t.id)).not.toContain(id)

    for (const role of ['reviewer', 'technician']) {
      const { client } = await addMember(owner, role)
      expect((await client.get('/api/templates')).body.map((t: any) => t.id)).toContain(id)
      expect((await client.get(`/api/templates/${id}`)).status).toBe(200)
      expect((await client.post('/api/templates', { name: `By ${role}`, body: partBody('radiator') })).status).toBe(403)
      expect((await client.patch(`/api/templates/${id}`, { name: `By ${role}` })).status).toBe(403)
      expect((await client.delete(`/api/templates/${id}`)).status).toBe(403)
    }
    const { client: fabricator } = await addMember(owner, 'fabricator')
    expect((await fabricator.patch(`/api/templates/${id}`, { name: 'Drain tap, shop stock' })).status).toBe(200)
    expect((await new Client().get('/api/templates')).status).toBe(401)
    expect((await sql`select name from part_templates where id = ${id}`)[0]!.name).toBe('Drain tap, shop stock')
  })
})
