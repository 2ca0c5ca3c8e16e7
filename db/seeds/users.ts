/**
 * Demo accounts, one per role, for the invented lab "Halvorsen Fine Chemicals, Solvent Recovery Laboratory".
 * DEMO ONLY: these passwords are printed by `npm start` and written in README; never use them on a real server.
 */
import { randomUUID } from 'node:crypto'
import { hash } from '@node-rs/argon2'
import type { Kysely } from 'kysely'
import type { Database } from '../../apps/api/src/db/index.js'

export const DEMO_PASSWORD = 'ebullio-demo-2026'

export const DEMO_USERS = [
  { email: 'analyst@demo.ebullio.test', displayName: 'Mira Okonkwo', roles: ['analyst'] },
  { email: 'lead@demo.ebullio.test', displayName: 'Dr. Tobias Lindqvist', roles: ['lead_chemist'] },
  // A second lead chemist, so a parameter set one of them fits can be signed by the other (four-eyes).
  { email: 'lead2@demo.ebullio.test', displayName: 'Dr. Amara Nwosu', roles: ['lead_chemist'] },
  { email: 'reviewer@demo.ebullio.test', displayName: 'Priya Raman', roles: ['reviewer'] },
  { email: 'engineer@demo.ebullio.test', displayName: 'Jonas Ferreira', roles: ['engineer'] },
  { email: 'admin@demo.ebullio.test', displayName: 'Elena Vasquez', roles: ['admin'] },
] as const

/** Create the demo users that do not exist yet; existing accounts are left exactly as they are. */
export async function seedUsers(db: Kysely<Database>): Promise<Record<string, string>> {
  const ids: Record<string, string> = {}
  for (const u of DEMO_USERS) {
    const existing = await db.selectFrom('app_user').select('id').where('email', '=', u.email).executeTakeFirst()
    if (existing) {
      ids[u.email] = existing.id
      continue
    }
    const id = randomUUID()
    await db.transaction().execute(async (tx) => {
      await tx
        .insertInto('app_user')
        .values({
          id,
          email: u.email,
          display_name: u.displayName,
          password_hash: await hash(DEMO_PASSWORD, { memoryCost: 19456, timeCost: 2, parallelism: 1 }),
        })
        .execute()
      await tx
        .insertInto('user_role')
        .values(u.roles.map((role) => ({ user_id: id, role })))
        .execute()
    })
    ids[u.email] = id
  }
  return ids
}
