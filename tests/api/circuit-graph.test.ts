import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { spawnSync } from 'node:child_process'
import { mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { demoDocument, correctedDemoDocument } from '#shared/demo'
import { analyzeCircuit } from '#shared/engine'
import { Client, addMember, signUp } from '../helpers/http'
import { sql } from '../helpers/db'

afterAll(() => sql.end())

let owner: Client
let projectId: string
let circuitId: string
beforeAll(async () => {
  owner = (await signUp('graph')).client
  projectId = (await owner.post('/api/projects', { title: 'Graph host' })).body.id
  circuitId = (await owner.post(`/api/projects/${projectId}/circuits`, { kind: 'coolant', title: 'Demo cooling' })).body.id
})

function demoTitled(title: string) {
  const doc = demoDocument()
  doc.circuit.title = title
  return doc
}

describe('saving and reading the drawn graph', () => {
  it('a new circuit reads back as an empty drawing at version 1', async () => {
    const res = await owner.get(`/api/circuits/${circuitId}/graph`)
    expect(res.status).toBe(200)
    expect(res.body.circuit.version).toBe(1)
    expect(res.body.document.format).toBe('hosewright.circuit')
    expect(res.body.document.circuit.components).toEqual([])
  })

  it('stores the document as rows and returns it exactly, with the same report the engine gives', async () => {
    const doc = demoTitled('Demo cooling')
    const saved = await owner.put(`/api/circuits/${circuitId}/graph`, { baseVersion: 1, document: doc })
    expect(saved.status).toBe(200)
    expect(saved.body.version).toBe(2)
    const read = await owner.get(`/api/circuits/${circuitId}/graph`)
    expect(read.body.document).toEqual(doc)
    expect(read.body.report).toEqual(JSON.parse(JSON.stringify(analyzeCircuit(doc))))
    // really rows, not a blob
    const [counts] = await sql`select
      (select count(*)::int from circuit_components where circuit_id = ${circuitId}) as components,
      (select count(*)::int from circuit_ports where circuit_id = ${circuitId}) as ports,
      (select count(*)::int from circuit_hoses where circuit_id = ${circuitId}) as hoses`
    expect(counts).toEqual({
      components: doc.circuit.components.length,
      ports: doc.circuit.components.reduce((n, c) => n + c.ports.length, 0),
      hoses: doc.circuit.hoses.length,
    })
  })

  it('a stale version answers 409 with the winning version and writes nothing', async () => {
    const before = await owner.get(`/api/circuits/${circuitId}/graph`)
    const changed = demoTitled('Demo cooling')
    changed.circuit.components = changed.circuit.components.slice(1)
    changed.circuit.hoses = []
    const stale = await owner.put(`/api/circuits/${circuitId}/graph`, { baseVersion: 1, document: changed })
    expect(stale.status).toBe(409)
    expect(stale.body.data.currentVersion).toBe(before.body.circuit.version)
    expect(stale.body.data.document).toEqual(before.body.document)
    const after = await owner.get(`/api/circuits/${circuitId}/graph`)
    expect(after.body.document).toEqual(before.body.document)
    expect(after.body.circuit.version).toBe(before.body.circuit.version)
  })

  it('many saves from one version at once: exactly one wins', async () => {
    const base = (await owner.get(`/api/circuits/${circuitId}/graph`)).body.circuit.version
    const attempts = await Promise.all(Array.from({ length: 8 }, (_, i) => {
      const doc = demoTitled(`Racing save ${i}`)
      return owner.put(`/api/circuits/${circuitId}/graph`, { baseVersion: base, document: doc })
    }))
    expect(attempts.filter(a => a.status === 200)).toHaveLength(1)
    expect(attempts.filter(a => a.status === 409)).toHaveLength(7)
    const winner = attempts.find(a => a.status === 200)!
    const read = await owner.get(`/api/circuits/${circuitId}/graph`)
    expect(read.body.circuit.version).toBe(winner.body.version)
    expect(read.body.document.circuit.title).toMatch(/^Racing save \d$/)
  })

  it('an invalid document is refused with every failing path, and nothing changes', async () => {
    const before = await owner.get(`/api/circuits/${circuitId}/graph`)
    const broken = demoDocument() as any
    broken.circuit.hoses[0].insideDiameterMm = -3
    broken.circuit.hoses[1].to.portId = 'no-such-port'
    delete broken.circuit.settings.allowance
    const res = await owner.put(`/api/circuits/${circuitId}/graph`, { baseVersion: before.body.circuit.version, document: broken })
    expect(res.status).toBe(400)
    const paths = res.body.data.issues.map((i: any) => i.path)
    expect(paths).toContain('document.circuit.hoses[0].insideDiameterMm')
    expect(paths).toContain('document.circuit.settings.allowance')
    expect((await owner.get(`/api/circuits/${circuitId}/graph`)).body.circuit.version).toBe(before.body.circuit.version)
    const dangling = demoDocument() as any
    dangling.circuit.hoses[1].to.portId = 'no-such-port'
    const res2 = await owner.put(`/api/circuits/${circuitId}/graph`, { baseVersion: before.body.circuit.version, document: dangling })
    expect(res2.status).toBe(400)
    expect(res2.body.data.issues.map((i: any) => i.path)).toContain('document.circuit.hoses[1].to.portId')
  })

  it('refuses a fuel document on a coolant circuit', async () => {
    const current = await owner.get(`/api/circuits/${circuitId}/graph`)
    const doc = demoDocument() as any
    doc.circuit.kind = 'fuel'
    delete doc.circuit.settings.coolant
    const res = await owner.put(`/api/circuits/${circuitId}/graph`, { baseVersion: current.body.circuit.version, document: doc })
    expect(res.status).toBe(400)
    expect((await owner.get(`/api/circuits/${circuitId}/graph`)).body.circuit.version).toBe(current.body.circuit.version)
  })

  it('keeps every saved version and reads each back', async () => {
    const list = await owner.get(`/api/circuits/${circuitId}/revisions`)
    const versions = list.body.map((r: any) => r.version)
    expect(versions[0]).toBe((await owner.get(`/api/circuits/${circuitId}/graph`)).body.circuit.version)
    expect(versions.at(-1)).toBe(1)
    const v2 = await owner.get(`/api/circuits/${circuitId}/revisions/2`)
    expect(v2.body.document).toEqual(demoTitled('Demo cooling'))
    expect(list.body.find((r: any) => r.version === 2).summary).toEqual(analyzeCircuit(demoTitled('Demo cooling')).counts)
    expect((await owner.get(`/api/circuits/${circuitId}/revisions/999`)).status).toBe(404)
    expect((await owner.get(`/api/circuits/${circuitId}/revisions/abc`)).status).toBe(404)
  })

  it('a rename is a new version, so an editor on the old one learns of it', async () => {
    const before = (await owner.get(`/api/circuits/${circuitId}/graph`)).body.circuit.version
    const renamed = await owner.patch(`/api/circuits/${circuitId}`, { title: 'Renamed cooling' })
    expect(renamed.body.version).toBe(before + 1)
    const read = await owner.get(`/api/circuits/${circuitId}/graph`)
    expect(read.body.document.circuit.title).toBe('Renamed cooling')
    expect((await owner.put(`/api/circuits/${circuitId}/graph`, { baseVersion: before, document: demoDocument() })).status).toBe(409)
  })
})

describe('exchange: export, import, analyse', () => {
  it('exports a document that imports as a new circuit, never over the old one', async () => {
    const exported = await owner.get(`/api/circuits/${circuitId}/export`)
    expect(exported.headers.get('content-disposition')).toMatch(/attachment; filename=".+\.hosewright\.json"/)
    const imported = await owner.post(`/api/projects/${projectId}/circuits/import`, { document: exported.body, title: 'Imported copy' })
    expect(imported.status).toBe(201)
    expect(imported.body.circuit.id).not.toBe(circuitId)
    const copy = await owner.get(`/api/circuits/${imported.body.circuit.id}/graph`)
    expect(copy.body.document.circuit.components).toEqual(exported.body.circuit.components)
    expect(copy.body.document.circuit.title).toBe('Imported copy')
    const original = await owner.get(`/api/circuits/${circuitId}/graph`)
    expect(original.body.document.circuit.title).toBe('Renamed cooling')
  })

  it('the CLI, the analyse route and the saved graph give the same report', async () => {
    const doc = correctedDemoDocument()
    const viaApi = await owner.post('/api/analyze', doc)
    expect(viaApi.status).toBe(200)
    const dir = mkdtempSync(join(tmpdir(), 'hw-cli-'))
    const file = join(dir, 'circuit.json')
    writeFileSync(file, JSON.stringify(doc))
    const cli = spawnSync('npx', ['tsx', 'scripts/check.ts', file], { encoding: 'utf8' })
    expect(JSON.parse(cli.stdout)).toEqual(viaApi.body)
    const created = await owner.post(`/api/projects/${projectId}/circuits/import`, { document: doc })
    const saved = await owner.get(`/api/circuits/${created.body.circuit.id}/graph`)
    expect(saved.body.report).toEqual(viaApi.body)
    const invalid = await owner.post('/api/analyze', { format: 'something-else' })
    expect(invalid.status).toBe(400)
    expect(invalid.body.data.issues.length).toBeGreaterThan(0)
  })
})

describe('graph access', () => {
  it('reviewers read but cannot save; other workshops get 404; signed-out 401', async () => {
    const { client: reviewer } = await addMember(owner, 'reviewer')
    const current = await reviewer.get(`/api/circuits/${circuitId}/graph`)
    expect(current.status).toBe(200)
    expect((await reviewer.put(`/api/circuits/${circuitId}/graph`, { baseVersion: current.body.circuit.version, document: demoDocument() })).status).toBe(403)
    const stranger = (await signUp('graph-stranger')).client
    expect((await stranger.get(`/api/circuits/${circuitId}/graph`)).status).toBe(404)
    expect((await stranger.put(`/api/circuits/${circuitId}/graph`, { baseVersion: current.body.circuit.version, document: demoDocument() })).status).toBe(404)
    expect((await stranger.get(`/api/circuits/${circuitId}/revisions`)).status).toBe(404)
    expect((await stranger.get(`/api/circuits/${circuitId}/export`)).status).toBe(404)
    expect((await new Client().post('/api/analyze', demoDocument())).status).toBe(401)
    expect((await owner.get(`/api/circuits/${circuitId}/graph`)).body.circuit.version).toBe(current.body.circuit.version)
  })
})
