import type { SystemDto } from '@ebullio/schemas'
import { sql, type RawBuilder } from 'kysely'
import type { Db } from '../db/index.js'
import { toComponent } from './components.repository.js'
import { componentRank } from './search-rank.js'

/** A binary system: component 1 is the lighter (lower-boiling) one by convention (the shared wire type, with Date timestamps). */
export type SystemRecord = SystemDto<Date>

async function hydrate(
  db: Db,
  rows: { id: string; component1_id: string; component2_id: string; notes: string | null; created_at: Date }[],
): Promise<SystemRecord[]> {
  const ids = [...new Set(rows.flatMap((r) => [r.component1_id, r.component2_id]))]
  const comps = ids.length ? await db.selectFrom('component').selectAll().where('id', 'in', ids).execute() : []
  const byId = new Map(comps.map((c) => [c.id, toComponent(c)]))
  return rows.map((r) => {
    const c1 = byId.get(r.component1_id)!
    const c2 = byId.get(r.component2_id)!
    return {
      id: r.id,
      component1: c1,
      component2: c2,
      name: `${c1.name} / ${c2.name}`,
      notes: r.notes,
      createdAt: r.created_at,
    }
  })
}

export async function findSystem(db: Db, id: string): Promise<SystemRecord | undefined> {
  const row = await db.selectFrom('binary_system').selectAll().where('id', '=', id).executeTakeFirst()
  return row ? (await hydrate(db, [row]))[0] : undefined
}

/** The system made of these two components, whichever way round it was entered. */
export async function findSystemByPair(db: Db, a: string, b: string): Promise<SystemRecord | undefined> {
  const row = await db
    .selectFrom('binary_system')
    .selectAll()
    .where((eb) =>
      eb.or([
        eb.and([eb('component1_id', '=', a), eb('component2_id', '=', b)]),
        eb.and([eb('component1_id', '=', b), eb('component2_id', '=', a)]),
      ]),
    )
    .executeTakeFirst()
  return row ? (await hydrate(db, [row]))[0] : undefined
}

/**
 * Systems whose component names, CAS numbers or formulas match `q` (best matches first; "a / b" asks for both), one page; with `published`, only systems that
 * have an approved or superseded data set (the engineers' catalogue).
 */
export async function listSystems(
  db: Db,
  o: { q?: string; published?: boolean; limit: number; offset: number },
): Promise<{ items: SystemRecord[]; total: number }> {
  let query = db
    .selectFrom('binary_system as s')
    .innerJoin('component as c1', 'c1.id', 's.component1_id')
    .innerJoin('component as c2', 'c2.id', 's.component2_id')
  if (o.published) {
    query = query.where((eb) =>
      eb.exists(
        eb
          .selectFrom('data_set as d')
          .select('d.id')
          .whereRef('d.system_id', '=', 's.id')
          .where('d.state', 'in', ['approved', 'superseded']),
      ),
    )
  }
  // "ethanol / water" asks for both components (either order); one word matches either component.
  const terms = (o.q ?? '')
    .split('/')
    .map((t) => t.trim())
    .filter(Boolean)
    .slice(0, 2)
  const r1 = (t: string) => componentRank('c1.', t)
  const r2 = (t: string) => componentRank('c2.', t)
  let rank: RawBuilder<number> | null = null
  if (terms.length === 1) {
    rank = sql<number>`least(${r1(terms[0])}, ${r2(terms[0])})`
  } else if (terms.length === 2) {
    const [a, b] = terms
    rank = sql<number>`least(greatest(${r1(a)}, ${r2(b)}), greatest(${r1(b)}, ${r2(a)}))`
  }
  if (rank) query = query.where(sql<boolean>`${rank} < 3`)
  const total = await query.select(sql<string>`count(*)`.as('n')).executeTakeFirstOrThrow()
  let ordered = query.selectAll('s')
  if (rank) ordered = ordered.orderBy(rank)
  const rows = await ordered.orderBy('c1.name').orderBy('c2.name').limit(o.limit).offset(o.offset).execute()
  return { items: await hydrate(db, rows), total: Number(total.n) }
}

export async function insertSystem(
  db: Db,
  s: { component1Id: string; component2Id: string; notes: string | null; createdBy: string },
): Promise<SystemRecord> {
  const row = await db
    .insertInto('binary_system')
    .values({
      component1_id: s.component1Id,
      component2_id: s.component2Id,
      notes: s.notes,
      created_by: s.createdBy,
    })
    .returningAll()
    .executeTakeFirstOrThrow()
  return (await hydrate(db, [row]))[0]
}
