// Direct access to the test database, to check what the API really wrote.
import postgres from 'postgres'

const url = process.env.HOSEWRIGHT_TEST_DATABASE_URL
if (!url) throw new Error('HOSEWRIGHT_TEST_DATABASE_URL is not set: run the suites through `npm test`')

export const sql = postgres(url, { max: 2, onnotice: () => {} })
