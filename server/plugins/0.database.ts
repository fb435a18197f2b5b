import { runMigrations } from '../database/migrate'
import { seedDemoIfEmpty } from '../database/seed'

// Nitro does not await async plugins, so the promise is kept and awaited by the
// server middleware `0.ready.ts` before any request is handled.
let ready: Promise<void> = Promise.resolve()

export function databaseReady(): Promise<void> {
  return ready
}

export default defineNitroPlugin(() => {
  ready = (async () => {
    if (process.env.HOSEWRIGHT_SKIP_MIGRATE !== '1') await runMigrations(databaseUrl())
    if (process.env.HOSEWRIGHT_SEED_DEMO === '1') {
      const seeded = await seedDemoIfEmpty(useDb(), hashPassword)
      if (seeded) console.info('[hosewright] demo workshop created')
    }
  })()
  ready.catch((error) => {
    console.error('[hosewright] database set-up failed:', error)
  })
  // the pool is closed by shutdown.ts, after the mail worker has stopped
})
