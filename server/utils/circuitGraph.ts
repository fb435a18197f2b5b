// The circuit graph as rows (components, ports, hoses) ⇄ the exchange document.
import { and, asc, eq } from 'drizzle-orm'
import type { CircuitDocument, Component, Hose, Point3 } from '#shared/circuit'
import { CIRCUIT_FORMAT, CIRCUIT_FORMAT_VERSION } from '#shared/circuit'
import { emptyCircuitSettings } from '#shared/circuit/defaults'
import type { PostgresJsDatabase } from 'drizzle-orm/postgres-js'
import * as schema from '../database/schema'
import type { CircuitRow } from '../database/schema'

type Db = PostgresJsDatabase<typeof schema>
type Executor = Db | Parameters<Parameters<Db['transaction']>[0]>[0]

/** Reads the graph rows of a circuit (scoped to the workshop) and rebuilds its document. */
export async function loadCircuitDocument(db: Executor, circuit: CircuitRow): Promise<CircuitDocument> {
  const scope = (t: { circuitId: any; workshopId: any }) => and(eq(t.circuitId, circuit.id), eq(t.workshopId, circuit.workshopId))
  const [components, ports, hoses] = await Promise.all([
    db.select().from(schema.circuitComponents).where(scope(schema.circuitComponents)).orderBy(asc(schema.circuitComponents.position)),
    db.select().from(schema.circuitPorts).where(scope(schema.circuitPorts)).orderBy(asc(schema.circuitPorts.position)),
    db.select().from(schema.circuitHoses).where(scope(schema.circuitHoses)).orderBy(asc(schema.circuitHoses.position)),
  ])
  const portsByComponent = new Map<string, typeof ports>()
  for (const p of ports) portsByComponent.set(p.componentId, [...(portsByComponent.get(p.componentId) ?? []), p])
  const body: CircuitDocument['circuit'] = {
    kind: circuit.kind,
    title: circuit.title,
    settings: (circuit.settings as CircuitDocument['circuit']['settings'] | null) ?? emptyCircuitSettings(circuit.kind),
    components: components.map(c => ({
      type: c.type,
      id: c.id,
      label: c.label,
      position: { x: c.x, y: c.y, z: c.z },
      rotationDeg: c.rotationDeg,
      volumeL: c.volumeL,
      ports: (portsByComponent.get(c.id) ?? []).map(p => ({
        id: p.id, name: p.name, role: p.role as never, spigotOdMm: p.spigotOdMm,
        offset: { x: p.offsetX, y: p.offsetY, z: p.offsetZ }, blocked: p.blocked,
      })),
      params: c.params,
    }) as Component),
    hoses: hoses.map((h) => {
      const hose: Hose = {
        id: h.id,
        from: end(h.fromPortId, h.fromPoint, h.fromClamp),
        to: end(h.toPortId, h.toPoint, h.toClamp),
        insideDiameterMm: h.insideDiameterMm,
        wallMm: h.wallMm,
        material: h.material as Hose['material'],
        params: h.params as Hose['params'],
      }
      if (h.measuredLengthMm !== null) hose.measuredLengthMm = h.measuredLengthMm
      return hose
    }),
  }
  if (circuit.notes !== null) body.notes = circuit.notes
  return { format: CIRCUIT_FORMAT, formatVersion: CIRCUIT_FORMAT_VERSION, circuit: body }
}

function end(portId: string | null, point: Point3 | null, clamp: string): Hose['from'] {
  const e: Hose['from'] = { portId, clamp: clamp as Hose['from']['clamp'] }
  if (point) e.point = point
  return e
}

// postgres.js sends every value as a parameter; PostgreSQL takes at most 65 535 per statement.
const CHUNK = 2000
async function insertChunked<T>(rows: T[], insert: (chunk: T[]) => Promise<unknown>) {
  for (let i = 0; i < rows.length; i += CHUNK) await insert(rows.slice(i, i + CHUNK))
}

/** Replaces the circuit's rows with the document's. Call inside the transaction that bumps the version. */
export async function writeCircuitRows(tx: Executor, circuit: CircuitRow, doc: CircuitDocument) {
  const key = { circuitId: circuit.id, workshopId: circuit.workshopId }
  const scope = (t: { circuitId: any; workshopId: any }) => and(eq(t.circuitId, circuit.id), eq(t.workshopId, circuit.workshopId))
  // hoses reference ports, ports reference components: delete in that order
  await tx.delete(schema.circuitHoses).where(scope(schema.circuitHoses))
  await tx.delete(schema.circuitPorts).where(scope(schema.circuitPorts))
  await tx.delete(schema.circuitComponents).where(scope(schema.circuitComponents))
  const c = doc.circuit
  await insertChunked(c.components.map((comp, position) => ({
    ...key, id: comp.id, position, type: comp.type, label: comp.label,
    x: comp.position.x, y: comp.position.y, z: comp.position.z,
    rotationDeg: comp.rotationDeg, volumeL: comp.volumeL, params: comp.params as Record<string, unknown>,
  })), chunk => tx.insert(schema.circuitComponents).values(chunk))
  let portPosition = 0
  await insertChunked(c.components.flatMap(comp => comp.ports.map(p => ({
    ...key, id: p.id, componentId: comp.id, position: portPosition++, name: p.name, role: p.role,
    spigotOdMm: p.spigotOdMm, offsetX: p.offset.x, offsetY: p.offset.y, offsetZ: p.offset.z, blocked: p.blocked,
  }))), chunk => tx.insert(schema.circuitPorts).values(chunk))
  await insertChunked(c.hoses.map((h, position) => ({
    ...key, id: h.id, position,
    fromPortId: h.from.portId, fromPoint: h.from.point ?? null, fromClamp: h.from.clamp,
    toPortId: h.to.portId, toPoint: h.to.point ?? null, toClamp: h.to.clamp,
    insideDiameterMm: h.insideDiameterMm, wallMm: h.wallMm, material: h.material,
    measuredLengthMm: h.measuredLengthMm ?? null, params: h.params as Record<string, unknown>,
  })), chunk => tx.insert(schema.circuitHoses).values(chunk))
}
