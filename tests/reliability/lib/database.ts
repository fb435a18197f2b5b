// Each reliability suite works on a database of its own, created fresh in the cluster of the test
// database: <base name>_<suffix>, base from HOSEWRIGHT_RELIABILITY_DATABASE_URL (scripts/test.sh)
// or HOSEWRIGHT_TEST_DATABASE_URL.
import postgres from 'postgres'

function baseUrl(): URL {
  const url = process.env.HOSEWRIGHT_RELIABILITY_DATABASE_URL ?? process.env.HOSEWRIGHT_TEST_DATABASE_URL
  if (!url) throw new Error('HOSEWRIGHT_RELIABILITY_DATABASE_URL (or HOSEWRIGHT_TEST_DATABASE_URL) is not set: run the suite through npm test')
  return new URL(url)
}

/** Drops and creates the suite's database; returns its URL. */
export async function freshDatabase(suffix: string): Promise<string> {
  const url = baseUrl()
  const name = `${url.pathname.slice(1)}_${suffix}`.replace(/[^a-z0-9_]/gi, '_')
  const admin = new URL(url)
  admin.pathname = '/postgres'
  const sql = postgres(admin.toString(), { max: 1, onnotice: () => {} })
  try {
    await sql.unsafe(`drop database if exists "${name}" with (force)`)
    await sql.unsafe(`create database "${name}"`)
  } finally {
    await sql.end()
  }
  url.pathname = `/${name}`
  return url.toString()
}
