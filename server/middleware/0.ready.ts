import { databaseReady } from '../plugins/0.database'

// Holds every request until migrations (and the optional demo seed) have finished.
export default defineEventHandler(async () => {
  await databaseReady()
})
