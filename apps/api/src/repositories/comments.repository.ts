import { sql } from 'kysely'
import type { Db } from '../db/index.js'

/** A comment on a data set, optionally pinned to a point; replies carry their thread's root in parentId. */
export interface CommentRecord {
  id: string
  dataSetId: string
  pointId: string | null
  parentId: string | null
  authorId: string
  authorName: string
  body: string
  resolved: boolean
  resolvedBy: string | null
  resolvedAt: Date | null
  createdAt: Date
}

export async function listComments(db: Db, dataSetId: string): Promise<CommentRecord[]> {
  const rows = await db
    .selectFrom('comment')
    .innerJoin('app_user', 'app_user.id', 'comment.author_id')
    .selectAll('comment')
    .select('app_user.display_name')
    .where('comment.data_set_id', '=', dataSetId)
    .orderBy('comment.created_at')
    .orderBy('comment.id')
    .execute()
  return rows.map((r) => ({
    id: r.id,
    dataSetId: r.data_set_id,
    pointId: r.point_id,
    parentId: r.parent_id,
    authorId: r.author_id,
    authorName: r.display_name,
    body: r.body,
    resolved: r.resolved,
    resolvedBy: r.resolved_by,
    resolvedAt: r.resolved_at,
    createdAt: r.created_at,
  }))
}

export async function findComment(db: Db, id: string) {
  return db.selectFrom('comment').selectAll().where('id', '=', id).executeTakeFirst()
}

export async function insertComment(
  db: Db,
  c: { dataSetId: string; pointId: string | null; parentId: string | null; authorId: string; body: string },
): Promise<string> {
  const r = await db
    .insertInto('comment')
    .values({
      data_set_id: c.dataSetId,
      point_id: c.pointId,
      parent_id: c.parentId,
      author_id: c.authorId,
      body: c.body,
    })
    .returning('id')
    .executeTakeFirstOrThrow()
  return r.id
}

export async function setResolved(db: Db, id: string, resolved: boolean, by: string): Promise<void> {
  await db
    .updateTable('comment')
    .set({ resolved, resolved_by: resolved ? by : null, resolved_at: resolved ? sql`now()` : null })
    .where('id', '=', id)
    .execute()
}

/** Unresolved threads (root comments) of a data set. */
export async function countOpenThreads(db: Db, dataSetId: string): Promise<number> {
  const r = await db
    .selectFrom('comment')
    .select(sql<number>`count(*)::int`.as('n'))
    .where('data_set_id', '=', dataSetId)
    .where('parent_id', 'is', null)
    .where('resolved', '=', false)
    .executeTakeFirstOrThrow()
  return r.n
}

/** One of "my open threads": a root comment with the data set version it belongs to (createdAt as stored). */
export interface OpenThreadRecord {
  id: string
  dataSetId: string
  pointId: string | null
  body: string
  createdAt: Date
  title: string
  version: number
}

/** Open threads the user started or replied to, newest first, one page (`limit`, `offset`). */
export async function listOpenThreadsOf(
  db: Db,
  userId: string,
  page: { limit: number; offset: number } = { limit: 1000, offset: 0 },
): Promise<{ items: OpenThreadRecord[]; total: number }> {
  const q = db
    .selectFrom('comment as c')
    .innerJoin('data_set as d', 'd.id', 'c.data_set_id')
    .where('c.parent_id', 'is', null)
    .where('c.resolved', '=', false)
    .where((eb) =>
      eb.or([
        eb('c.author_id', '=', userId),
        eb.exists(
          eb
            .selectFrom('comment as r')
            .select('r.id')
            .whereRef('r.parent_id', '=', 'c.id')
            .where('r.author_id', '=', userId),
        ),
      ]),
    )
  const total = await q.select(sql<string>`count(*)`.as('n')).executeTakeFirstOrThrow()
  const rows = await q
    .select(['c.id', 'c.data_set_id', 'c.point_id', 'c.body', 'c.created_at', 'd.title', 'd.version'])
    .orderBy('c.created_at', 'desc')
    .orderBy('c.id')
    .limit(page.limit)
    .offset(page.offset)
    .execute()
  // Mapped to camelCase like every other route's answer.
  const items = rows.map((r) => ({
    id: r.id,
    dataSetId: r.data_set_id,
    pointId: r.point_id,
    body: r.body,
    createdAt: r.created_at,
    title: r.title,
    version: r.version,
  }))
  return { items, total: Number(total.n) }
}
