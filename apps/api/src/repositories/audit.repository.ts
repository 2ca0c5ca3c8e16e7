import type { Db } from '../db/index.js'

/** One line of the audit trail: who did what to which entity, with a before/after summary. */
export interface AuditInput {
  actorId: string | null
  entity: string
  entityId: string
  action: string
  dataSetId?: string | null
  before?: unknown
  after?: unknown
}

export interface AuditRecord {
  id: string
  at: Date
  actorId: string | null
  actorName: string | null
  entity: string
  entityId: string
  action: string
  dataSetId: string | null
  before: unknown
  after: unknown
}

const json = (v: unknown) => (v === undefined || v === null ? null : JSON.stringify(v))

/** Append to the audit log (the table rejects UPDATE and DELETE). Call inside the change's transaction. */
export async function appendAudit(db: Db, e: AuditInput): Promise<void> {
  await db
    .insertInto('audit_log')
    .values({
      actor_id: e.actorId,
      entity: e.entity,
      entity_id: e.entityId,
      action: e.action,
      data_set_id: e.dataSetId ?? null,
      before: json(e.before),
      after: json(e.after),
    })
    .execute()
}

/** The audit trail of every version in a data set's lineage, oldest first. */
export async function listAuditForLineage(db: Db, lineageId: string): Promise<AuditRecord[]> {
  const rows = await db
    .selectFrom('audit_log')
    .leftJoin('app_user', 'app_user.id', 'audit_log.actor_id')
    .selectAll('audit_log')
    .select('app_user.display_name')
    .where('audit_log.data_set_id', 'in', db.selectFrom('data_set').select('id').where('lineage_id', '=', lineageId))
    .orderBy('audit_log.id', 'asc')
    .execute()
  return rows.map((r) => ({
    id: String(r.id),
    at: r.at,
    actorId: r.actor_id,
    actorName: r.display_name,
    entity: r.entity,
    entityId: r.entity_id,
    action: r.action,
    dataSetId: r.data_set_id,
    before: r.before,
    after: r.after,
  }))
}

export interface AuditQuery {
  entity?: string
  entityId?: string
  actorId?: string
  action?: string
  after?: Date
  before?: Date
  order: 'asc' | 'desc'
  limit: number
  offset: number
}

/** One page of the whole audit log (all entities, not only lab data), in append order. */
export async function listAudit(db: Db, f: AuditQuery): Promise<{ items: AuditRecord[]; total: number }> {
  let q = db.selectFrom('audit_log').leftJoin('app_user', 'app_user.id', 'audit_log.actor_id')
  if (f.entity) q = q.where('audit_log.entity', '=', f.entity)
  if (f.entityId) q = q.where('audit_log.entity_id', '=', f.entityId)
  if (f.actorId) q = q.where('audit_log.actor_id', '=', f.actorId)
  if (f.action) q = q.where('audit_log.action', '=', f.action)
  if (f.after) q = q.where('audit_log.at', '>=', f.after)
  if (f.before) q = q.where('audit_log.at', '<', f.before)
  const total = await q.select((eb) => eb.fn.countAll<string>().as('n')).executeTakeFirstOrThrow()
  const rows = await q
    .selectAll('audit_log')
    .select('app_user.display_name')
    .orderBy('audit_log.id', f.order)
    .limit(f.limit)
    .offset(f.offset)
    .execute()
  return {
    items: rows.map((r) => ({
      id: String(r.id),
      at: r.at,
      actorId: r.actor_id,
      actorName: r.display_name,
      entity: r.entity,
      entityId: r.entity_id,
      action: r.action,
      dataSetId: r.data_set_id,
      before: r.before,
      after: r.after,
    })),
    total: Number(total.n),
  }
}

/** Distinct (actor, action) pairs of one data set version's audit entries among `actions`. */
export async function actorsOf(
  db: Db,
  dataSetId: string,
  actions: readonly string[],
): Promise<{ actorId: string; action: string }[]> {
  const rows = await db
    .selectFrom('audit_log')
    .select(['actor_id', 'action'])
    .distinct()
    .where('data_set_id', '=', dataSetId)
    .where('action', 'in', [...actions])
    .where('actor_id', 'is not', null)
    .execute()
  return rows.map((r) => ({ actorId: r.actor_id!, action: r.action }))
}
