import { and, eq, sql } from 'drizzle-orm'
import { CIRCUIT_FORMAT, CIRCUIT_FORMAT_VERSION, parseCircuitDocument, type CircuitDocument } from '#shared/circuit'
import { emptyCircuitSettings } from '#shared/circuit/defaults'
import { analyzeCircuit } from '#shared/engine'
import type { Database } from './db'
import type { CircuitRow } from '../database/schema'
import { writeCircuitRows } from './circuitGraph'
import { rememberReport } from './reportCache'

type Tx = Parameters<Parameters<Database['transaction']>[0]>[0]

/** A document from a request body, or 400 listing every failing path. */
export function documentOrFail(input: unknown, pathPrefix = 'document.'): CircuitDocument {
  const parsed = parseCircuitDocument(input)
  if (!parsed.ok) {
    invalidInput(parsed.issues.map(i => ({ path: `${pathPrefix}${i.path}`, message: i.message })),
      `The circuit document is not valid (${parsed.issues.length} problem${parsed.issues.length === 1 ? '' : 's'}).`)
  }
  return parsed.document
}

export function summaryOf(doc: CircuitDocument) {
  const report = analyzeCircuit(doc)
  return { report, summary: report.counts }
}

/** The document of a circuit nobody has drawn yet. */
export function emptyCircuitDocument(kind: CircuitDocument['circuit']['kind'], title: string): CircuitDocument {
  return {
    format: CIRCUIT_FORMAT, formatVersion: CIRCUIT_FORMAT_VERSION,
    circuit: { kind, title, settings: emptyCircuitSettings(kind), components: [], hoses: [] },
  }
}

/** Stores a document as a new version of the circuit: rows replaced, revision kept. */
export async function storeVersion(tx: Tx, circuit: CircuitRow, version: number, doc: CircuitDocument, userId: string) {
  await writeCircuitRows(tx, circuit, doc)
  const { report, summary } = summaryOf(doc)
  await tx.insert(schema.circuitRevisions).values({
    circuitId: circuit.id, workshopId: circuit.workshopId, version,
    document: doc as unknown as Record<string, unknown>, summary, savedBy: userId,
  })
  return report
}

/**
 * Saves the document if the circuit is still at `baseVersion`; otherwise 409 with the version and
 * document that won, so the editor can show what differs. Nothing is written on a conflict.
 */
export async function saveCircuit(workshopId: string, userId: string, circuitId: string, baseVersion: number, doc: CircuitDocument) {
  const db = useDb()
  const saved = await db.transaction(async (tx) => {
    // the version bump is the lock: of many concurrent saves from one base, exactly one matches
    const [bumped] = await tx.update(schema.circuits)
      .set({
        version: sql`${schema.circuits.version} + 1`, title: doc.circuit.title,
        settings: doc.circuit.settings as Record<string, unknown>, notes: doc.circuit.notes ?? null, updatedAt: new Date(),
      })
      .where(and(eq(schema.circuits.id, circuitId), eq(schema.circuits.workshopId, workshopId), eq(schema.circuits.version, baseVersion)))
      .returning()
    if (!bumped) {
      const current = await findCircuit(tx, workshopId, circuitId)
      throw createError({
        statusCode: 409, statusMessage: 'Saved by someone else first',
        message: `This circuit was saved as version ${current.version} while you edited version ${baseVersion}.`,
        data: { currentVersion: current.version, document: await loadCurrentDocument(tx, current) },
      })
    }
    if (bumped.kind !== doc.circuit.kind) {
      invalidInput([{ path: 'document.circuit.kind', message: `This is a ${bumped.kind} circuit; the document is ${doc.circuit.kind}` }])
    }
    const report = await storeVersion(tx, bumped, bumped.version, doc, userId)
    await tx.update(schema.projects).set({ updatedAt: new Date() }).where(eq(schema.projects.id, bumped.projectId))
    return { version: bumped.version, report, updatedAt: bumped.updatedAt }
  })
  // committed: the next load of this version need not analyse it again
  rememberReport(circuitId, saved.version, saved.updatedAt, saved.report)
  return { version: saved.version, report: saved.report }
}

async function loadCurrentDocument(tx: Tx, circuit: CircuitRow) {
  const [rev] = await tx.select({ document: schema.circuitRevisions.document }).from(schema.circuitRevisions)
    .where(and(eq(schema.circuitRevisions.circuitId, circuit.id), eq(schema.circuitRevisions.workshopId, circuit.workshopId), eq(schema.circuitRevisions.version, circuit.version)))
  return rev?.document ?? null
}
