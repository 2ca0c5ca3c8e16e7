// Empty a database completely (drop and recreate the public schema). Only for throw-away test databases.
import pg from 'pg'

const url = process.argv[2]
if (!url || !/test/.test(new URL(url).pathname)) {
  console.error(`refusing to reset ${url}: test database names contain "test"`)
  process.exit(2)
}
const c = new pg.Client({ connectionString: url })
await c.connect()
await c.query('drop schema public cascade; create schema public')
await c.end()
