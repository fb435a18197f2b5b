// `npm run db:migrate`: apply drizzle/ migrations to DATABASE_URL (the app also does this at start).
import { runMigrations } from '../server/database/migrate'

const url = process.env.DATABASE_URL
if (!url) {
  console.error('DATABASE_URL is not set (scripts/db.sh url prints the local one)')
  process.exit(2)
}
await runMigrations(url)
console.log('migrations applied')
