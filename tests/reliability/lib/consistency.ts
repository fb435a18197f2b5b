// What must hold in the database (and the bucket) after any crash: the circuit's rows are exactly
// the document of its current version, nothing dangles, every acknowledged write is there.
import type postgres from 'postgres'
import { expect } from 'vitest'
import type { CircuitDocument } from '#shared/circuit'
import type { AppClient } from './client'
import { listKeys, type FakeS3 } from './fakes'

export interface Acknowledged {
  /** version → the document the server answered 200 for */
  saves: Map<number, CircuitDocument>
  photoIds: Set<string>
}

export async function checkCircuit(sql: postgres.Sql, client: AppClient, circuitId: string, acked: Acknowledged) {
  const [c] = await sql`select c.version,
      (select max(r.version) from circuit_revisions r where r.circuit_id = c.id) as newest_revision
    from circuits c where c.id = ${circuitId}`
  expect(c!.newest_revision, 'the current version has the newest revision').toBe(c!.version)
  const [current] = await sql`select document from circuit_revisions where circuit_id = ${circuitId} and version = ${c!.version}`
  const graph = await client.get(`/api/circuits/${circuitId}/graph`)
  expect(graph.status).toBe(200)
  expect(graph.body.circuit.version).toBe(c!.version)
  expect(graph.body.document, 'rows rebuild the document of the current version').toEqual(current!.document)

  const [orphans] = await sql`select
    (select count(*)::int from circuit_ports p where not exists (select 1 from circuit_components k
      where k.circuit_id = p.circuit_id and k.id = p.component_id)) as ports,
    (select count(*)::int from circuit_hoses h where
      (h.from_port_id is not null and not exists (select 1 from circuit_ports p where p.circuit_id = h.circuit_id and p.id = h.from_port_id))
      or (h.to_port_id is not null and not exists (select 1 from circuit_ports p where p.circuit_id = h.circuit_id and p.id = h.to_port_id))) as hoses,
    (select count(*)::int from circuit_components k where not exists (select 1 from circuits x where x.id = k.circuit_id)) as components`
  expect(orphans).toEqual({ ports: 0, hoses: 0, components: 0 })

  const newestAcked = Math.max(1, ...acked.saves.keys())
  expect(c!.version, 'no acknowledged save is lost').toBeGreaterThanOrEqual(newestAcked)
  const revisions = await sql`select version, document from circuit_revisions where circuit_id = ${circuitId}`
  const byVersion = new Map(revisions.map(r => [r.version as number, r.document]))
  for (const [version, doc] of acked.saves) expect(byVersion.get(version), `acknowledged version ${version}`).toEqual(doc)
  return { version: c!.version as number, unacknowledgedCommitted: c!.version - newestAcked }
}

/** Rows ↔ objects: every row's image and thumbnail exist; returns objects no row points at. */
export async function checkPhotos(sql: postgres.Sql, s3: FakeS3, circuitId: string, acked: Acknowledged) {
  const rows = await sql`select id, object_key, thumbnail_key from part_photos where circuit_id = ${circuitId}`
  const ids = new Set(rows.map(r => r.id as string))
  for (const id of acked.photoIds) expect(ids.has(id), `acknowledged photo ${id}`).toBe(true)
  const keys = new Set((await listKeys(s3)).filter(k => k.includes(`/${circuitId}/`)))
  for (const r of rows) {
    expect(keys.has(r.object_key), `image of photo ${r.id}`).toBe(true)
    expect(keys.has(r.thumbnail_key), `thumbnail of photo ${r.id}`).toBe(true)
  }
  const referenced = new Set(rows.flatMap(r => [r.object_key as string, r.thumbnail_key as string]))
  return { rows: rows.length, unreferencedObjects: [...keys].filter(k => !referenced.has(k)).length }
}
