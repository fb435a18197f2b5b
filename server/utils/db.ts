import postgres from 'postgres'
import { drizzle } from 'drizzle-orm/postgres-js'
import * as schema from '../database/schema'

export { schema }
export type Database = ReturnType<typeof drizzle<typeof schema>>

let client: ReturnType<typeof postgres> | undefined
let database: Database | undefined

export function databaseUrl(): string {
  const url = process.env.DATABASE_URL || useRuntimeConfig().databaseUrl
  if (!url) throw new Error('DATABASE_URL is not set: start the app with `npm start`, or set it to a PostgreSQL URL')
  return url
}

/** The process-wide connection pool (postgres.js) wrapped by Drizzle. */
export function useDb(): Database {
  if (!database) {
    client = postgres(databaseUrl(), { max: Number(process.env.DATABASE_POOL_SIZE ?? 10), onnotice: () => {} })
    database = drizzle(client, { schema })
  }
  return database
}

export async function closeDb(): Promise<void> {
  await client?.end({ timeout: 5 })
  client = undefined
  database = undefined
}
