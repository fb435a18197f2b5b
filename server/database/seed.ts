import { count } from 'drizzle-orm'
import type { PostgresJsDatabase } from 'drizzle-orm/postgres-js'
import * as schema from './schema'
import { demoAccounts, demoPassword, demoProject, demoWorkshop } from './demo'
import { demoDocument, fuelDemoDocument } from '../../shared/demo'
import { analyzeCircuit } from '../../shared/engine'
import { writeCircuitRows } from '../utils/circuitGraph'

type Db = PostgresJsDatabase<typeof schema>

/** Creates the demo workshop, its four members and the demo build (coolant and fuel circuits) — only into an empty database. */
export async function seedDemoIfEmpty(db: Db, hash: (password: string) => Promise<string>): Promise<boolean> {
  const [users] = await db.select({ n: count() }).from(schema.users)
  if ((users?.n ?? 0) > 0) return false
  const passwordHash = await hash(demoPassword)
  await db.transaction(async (tx) => {
    const [workshop] = await tx.insert(schema.workshops).values(demoWorkshop).returning()
    let createdBy: string | undefined
    for (const account of demoAccounts) {
      const [user] = await tx.insert(schema.users).values({ email: account.email, name: account.name, passwordHash }).returning()
      await tx.insert(schema.memberships).values({ workshopId: workshop!.id, userId: user!.id, role: account.role })
      if (account.role === 'fabricator') createdBy = user!.id
    }
    const [project] = await tx.insert(schema.projects).values({ ...demoProject, workshopId: workshop!.id, createdBy }).returning()
    // the demo drawings keep their deliberate problems: the coolant one an open third outlet and an
    // unbled heater high point, the fuel conversion its return line still to run
    for (const document of [demoDocument(), fuelDemoDocument()]) {
      const [circuit] = await tx.insert(schema.circuits).values({
        workshopId: workshop!.id, projectId: project!.id, kind: document.circuit.kind, title: document.circuit.title,
        settings: document.circuit.settings as Record<string, unknown>, notes: document.circuit.notes ?? null,
      }).returning()
      await writeCircuitRows(tx, circuit!, document)
      await tx.insert(schema.circuitRevisions).values({
        circuitId: circuit!.id, workshopId: workshop!.id, version: circuit!.version,
        document: document as unknown as Record<string, unknown>, summary: analyzeCircuit(document).counts, savedBy: createdBy,
      })
    }
  })
  return true
}
