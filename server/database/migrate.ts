// Applies the generated SQL migrations in drizzle/. Used by the built server at start and by
// scripts/migrate.ts; plain Node so both can call it.
import { existsSync } from 'node:fs'
import { dirname, resolve } from 'node:path'
import postgres from 'postgres'
import { drizzle } from 'drizzle-orm/postgres-js'
import { migrate } from 'drizzle-orm/postgres-js/migrator'

/** The migrations folder: next to the built server entry (.output/server/drizzle) or in the checkout. */
export function findMigrationsFolder(): string {
  const candidates = [
    process.env.HOSEWRIGHT_MIGRATIONS_DIR,
    process.argv[1] ? resolve(dirname(process.argv[1]), 'drizzle') : undefined,
    resolve(process.cwd(), 'drizzle'),
  ].filter((c): c is string => Boolean(c))
  const found = candidates.find(dir => existsSync(resolve(dir, 'meta/_journal.json')))
  if (!found) throw new Error(`No Drizzle migrations found (looked in ${candidates.join(', ')})`)
  return found
}

export async function runMigrations(databaseUrl: string, folder = findMigrationsFolder()): Promise<void> {
  // one short-lived connection; notices about existing schemas are noise here
  const sql = postgres(databaseUrl, { max: 1, onnotice: () => {} })
  try {
    await migrate(drizzle(sql), { migrationsFolder: folder })
  } finally {
    await sql.end({ timeout: 5 })
  }
}
