import { sql } from 'drizzle-orm'

// Liveness and database reachability, for scripts and monitors. No data is returned.
export default defineEventHandler(async (event) => {
  try {
    await useDb().execute(sql`select 1`)
    return { ok: true, database: 'up' }
  } catch {
    setResponseStatus(event, 503)
    return { ok: false, database: 'down' }
  }
})
