import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import sharp from 'sharp'
import { demoDocument } from '#shared/demo'
import { templateFromComponent } from '#shared/schemas/template'
import { Client, goodPassword, signUp, uniqueEmail } from '../helpers/http'
import { sql } from '../helpers/db'

// Hostile text is data: SQL-injection and markup strings typed into any text field are stored and
// read back exactly as typed (queries are parameterised, nothing is filtered or "cleaned"), and the
// pages show them as text (tests/e2e/csp.test.ts). OWASP's injection and XSS prevention cheat
// sheets (from memory): parameterise queries, encode on output, do not rely on input filters.
afterAll(() => sql.end())

const hostile = [
  `x'); delete from users; --`,
  `" or 1=1 --`,
  `<img src=x onerror=window.__xss=1>`,
  `<script>window.__xss=2</script>`,
  `"><svg onload=window.__xss=3>`,
  `{{ 7 * 7 }} \${7*7} javascript:void(0)`,
  `\u202egnp.exe · 圧力 · ✓ · \\ back\\slash`,
]

let owner: Client
let projectId: string
let circuitId: string
beforeAll(async () => {
  owner = (await signUp('hostile')).client
})

describe('hostile text is stored verbatim and read back equal', () => {
  it('projects: title, vehicle, engine and notes', async () => {
    for (const text of hostile) {
      const created = await owner.post('/api/projects', { title: text, vehicle: text, engine: text, notes: `${text}\n${text}` })
      expect(created.status, text).toBe(201)
      const read = await owner.get(`/api/projects/${created.body.id}`)
      expect(read.body).toMatchObject({ title: text, vehicle: text, engine: text, notes: `${text}\n${text}` })
      const [row] = await sql`select title, notes from projects where id = ${created.body.id}`
      expect(row).toEqual({ title: text, notes: `${text}\n${text}` })
      projectId = created.body.id
    }
    // the injection did nothing: the tables are all still there and answer
    expect((await sql`select count(*)::int as n from users`)[0]!.n).toBeGreaterThan(0)
    // searching with injection text finds the one project titled so, not every project (1=1)
    const search = await owner.get(`/api/projects?q=${encodeURIComponent(`" or 1=1 --`)}`)
    expect(search.status).toBe(200)
    expect(search.body.total).toBe(1)
    expect(search.body.items[0].title).toBe(`" or 1=1 --`)
    const none = await owner.get(`/api/projects?q=${encodeURIComponent(`' or 1=1 --`)}`)
    expect(none.body.total).toBe(0)
  })

  it('circuits: title, notes, part labels and port names in the drawn document', async () => {
    circuitId = (await owner.post(`/api/projects/${projectId}/circuits`, { kind: 'coolant', title: hostile[0] })).body.id
    expect((await owner.get(`/api/circuits/${circuitId}`)).body.title).toBe(hostile[0])
    const doc = demoDocument()
    doc.circuit.title = hostile[2]!
    doc.circuit.notes = hostile.join('\n')
    doc.circuit.components.forEach((c, i) => {
      c.label = hostile[i % hostile.length]!
      c.ports.forEach((p, j) => { p.name = hostile[(i + j) % hostile.length]!.slice(0, 80) })
    })
    const saved = await owner.put(`/api/circuits/${circuitId}/graph`, { baseVersion: 1, document: doc })
    expect(saved.status).toBe(200)
    expect((await owner.get(`/api/circuits/${circuitId}/graph`)).body.document).toEqual(doc)
    const labels = await sql`select label from circuit_components where circuit_id = ${circuitId} order by position`
    expect(labels.map(r => r.label)).toEqual(doc.circuit.components.map(c => c.label))
    const exported = await owner.get(`/api/circuits/${circuitId}/export`)
    expect(exported.body.circuit.notes).toBe(doc.circuit.notes)
  })

  it('comments and replies', async () => {
    for (const text of hostile) {
      const res = await owner.post(`/api/circuits/${circuitId}/comments`, { body: text, version: 2 })
      expect(res.status, text).toBe(201)
      expect(res.body.body).toBe(text)
    }
    const listed = await owner.get(`/api/circuits/${circuitId}/comments`)
    const bodies = JSON.stringify(listed.body)
    for (const text of hostile) expect(bodies).toContain(JSON.stringify(text).slice(1, -1))
  })

  it('part template names', async () => {
    const body = templateFromComponent(demoDocument().circuit.components.find(c => c.id === 'thermostat')!)
    for (const [i, text] of hostile.entries()) {
      const res = await owner.post('/api/templates', { name: `${text} ${i}`, body })
      expect(res.status, text).toBe(201)
      expect((await owner.get(`/api/templates/${res.body.id}`)).body.name).toBe(`${text} ${i}`)
    }
  })

  it('custom shopping-list lines', async () => {
    const path = `/api/circuits/${circuitId}/versions/2/shop/lines`
    const text = hostile[3]!
    const added = await owner.post(path, { description: text, quantity: 2, unit: hostile[0]!.slice(0, 30), supplier: hostile[1], notes: hostile[4] })
    expect(added.status).toBe(201)
    const [row] = await sql`select custom, supplier from shop_lines where circuit_id = ${circuitId} and line_id = ${added.body.lineId}`
    expect(row!.custom).toMatchObject({ description: text, unit: hostile[0]!.slice(0, 30), notes: hostile[4] })
    expect(row!.supplier).toBe(hostile[1])
  })

  it('people: account name, workshop name, invitation name', async () => {
    const name = hostile[2]!
    const signed = await new Client().post('/api/account', { name, email: uniqueEmail('hostile-name'), password: goodPassword, workshopName: hostile[0] })
    expect(signed.status).toBe(201)
    expect(signed.body.user.name).toBe(name)
    expect(signed.body.workshop.name).toBe(hostile[0])
    const renamed = await owner.patch('/api/account', { name: hostile[4] })
    expect(renamed.status).toBe(200)
    expect((await owner.get('/api/session')).body.user.name).toBe(hostile[4])
    const invited = await owner.post('/api/members', { email: uniqueEmail('hostile-invite'), role: 'reviewer', name: hostile[3] })
    expect(invited.status).toBe(201)
    const [row] = await sql`select name from invitations where id = ${invited.body.id}`
    expect(row!.name).toBe(hostile[3])
  })

  it('a NUL character, which PostgreSQL text cannot hold, is refused with 400, never a 500', async () => {
    for (const [path, body] of [
      ['/api/projects', { title: 'before\u0000after' }],
      [`/api/circuits/${circuitId}/comments`, { body: 'a\u0000b', version: 2 }],
    ] as const) {
      const res = await owner.post(path, body)
      expect(res.status, path).toBe(400)
    }
  })
})

describe('uploads: the bytes decide, the name is only a label', () => {
  async function upload(name: string, data: Buffer, type = 'image/png') {
    const form = new FormData()
    form.append('componentId', 'radiator')
    form.append('file', new Blob([new Uint8Array(data)], { type }), name)
    const headers: Record<string, string> = { accept: 'application/json', cookie: [...owner.cookies].map(([k, v]) => `${k}=${v}`).join('; ') }
    const res = await fetch(`${process.env.HOSEWRIGHT_TEST_URL}/api/circuits/${circuitId}/photos`, { method: 'POST', body: form, headers })
    return { status: res.status, body: await res.json() as any }
  }
  let tinyPng: Buffer
  beforeAll(async () => {
    tinyPng = await sharp({ create: { width: 4, height: 4, channels: 3, background: '#0d6b73' } }).png().toBuffer()
  })

  it('path-like and NUL names are stored only as labels, never in object keys', async () => {
    for (const name of ['../../etc/passwd.png', '..\\..\\x.jpg', 'night\u0000shot.png']) {
      const res = await upload(name, tinyPng)
      expect(res.status, name).toBe(201)
      const [row] = await sql`select label, object_key from part_photos where id = ${res.body.id}`
      expect(row!.label).toBe(name.replace('\u0000', ''))
      expect(row!.object_key).toMatch(/^[0-9a-f-]{36}\/[0-9a-f-]{36}\/[0-9a-f-]{36}$/)
    }
  })

  it('markup named as a picture is refused with 415 and nothing is stored', async () => {
    const before = (await sql`select count(*)::int as n from part_photos where circuit_id = ${circuitId}`)[0]!.n
    const svg = Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>window.__xss=4</script></svg>')
    const html = Buffer.from('<!doctype html><html><body><script>window.__xss=5</script></body></html>')
    expect((await upload('drawing.png', svg, 'image/png')).status).toBe(415)
    expect((await upload('photo.jpg', html, 'image/jpeg')).status).toBe(415)
    expect((await upload('vector.svg', svg, 'image/svg+xml')).status).toBe(415)
    expect((await sql`select count(*)::int as n from part_photos where circuit_id = ${circuitId}`)[0]!.n).toBe(before)
  })

  it('a picture with markup appended is served only as the image type it is, with nosniff', async () => {
    const polyglot = Buffer.concat([tinyPng, Buffer.from('<script>window.__xss=6</script>')])
    const res = await upload('<b>bold</b>.png', polyglot)
    expect(res.status).toBe(201)
    const image = await fetch(`${process.env.HOSEWRIGHT_TEST_URL}${res.body.imageUrl}`, { headers: { cookie: [...owner.cookies].map(([k, v]) => `${k}=${v}`).join('; ') } })
    expect(image.headers.get('content-type')).toBe('image/png')
    expect(image.headers.get('x-content-type-options')).toBe('nosniff')
    expect(image.headers.get('content-disposition')).toBe(`inline; filename*=UTF-8''${encodeURIComponent('<b>bold</b>.png')}`)
  })
})
