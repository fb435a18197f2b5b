import { defineConfig } from 'drizzle-kit'

// `npm run db:generate` turns server/database/schema.ts into SQL in drizzle/ (no database needed).
export default defineConfig({
  dialect: 'postgresql',
  schema: './server/database/schema/index.ts',
  out: './drizzle',
  dbCredentials: { url: process.env.DATABASE_URL ?? 'postgres://hosewright@127.0.0.1:54329/hosewright' },
})
