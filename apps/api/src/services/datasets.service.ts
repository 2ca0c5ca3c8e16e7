/** Data sets: create, list, read with points and fits, edit metadata, exclude points, revise an approved version. */
import type { Kysely } from 'kysely'
import type { SessionUser } from '../auth/index.js'
import type { Database, Db } from '../db/index.js'
import type { DataSetState } from '../db/lab-tables.js'
import { dataKindOf, missingVirialData, type VaporModelChoice } from '@ebullio/schemas'
import { AppError, conflict, forbidden, notFound } from '../errors/index.js'
import { listApprovals } from '../repositories/approvals.repository.js'
import { appendAudit, listAuditForLineage } from '../repositories/audit.repository.js'
import { listComments } from '../repositories/comments.repository.js'
import { openJointFitsOf as jointFitsWith } from '../repositories/joint-fits.repository.js'
import * as repo from '../repositories/datasets.repository.js'
import { copyFits, listConsistency, listFits } from '../repositories/fits.repository.js'
import * as points from '../repositories/points.repository.js'
import { listUploadsOf } from '../repositories/uploads.repository.js'
import { calibrationsOfDataSet } from '../repositories/calibrations.repository.js'
import {
  EDITABLE_STATES,
  FITTABLE_STATES,
  PUBLISHED_STATES,
  pageWindow,
  readsEverything,
  requireState,
  staleWrite,
  visibleOrNotFound,
} from './lab-access.js'
import { engineVapor, getSystem } from './systems.service.js'
import { pointSetOf, withStale } from './point-set.js'
import { vapourCorrectionOf } from './vapour-correction.js'
import { checkVaporModel } from '@ebullio/thermo'

export interface DataSetInput {
  systemId: string
  title: string
  nominalPressurePa: number | null
  nominalTemperatureK?: number | null
  vaporModel?: repo.DataSetRecord['vaporModel']
  apparatusNotes: string | null
  projectRef: string | null
  origin?: repo.DataSetRecord['origin']
  originMethod?: string | null
  citation?: repo.DataSetRecord['citation']
  layout?: repo.DataSetRecord['layout']
}

export async function createDataSet(db: Db, actorId: string, input: DataSetInput): Promise<repo.DataSetRecord> {
  await getSystem(db, input.systemId)
  checkOriginAfter({
    origin: input.origin ?? 'gc',
    citation: input.citation ?? null,
    originMethod: input.originMethod ?? null,
  })
  const nominal = nominalCondition(input.layout ?? 'txy', input.nominalPressurePa, input.nominalTemperatureK ?? null)
  if (input.vaporModel?.kind === 'virial') await requireVirialData(db, input.systemId, input.vaporModel)
  const d = await repo.insertDataSet(db, { ...input, ...nominal, createdBy: actorId })
  await appendAudit(db, {
    actorId,
    entity: 'data_set',
    entityId: d.id,
    action: 'create',
    dataSetId: d.id,
    after: input,
  })
  return d
}

export interface ListOptions {
  state?: DataSetState[]
  systemId?: string
  createdBy?: string
  q?: string
  pressureMinPa?: number
  pressureMaxPa?: number
  createdAfter?: Date
  createdBefore?: Date
  updatedAfter?: Date
  updatedBefore?: Date
  sort: repo.DataSetQuery['sort']
  order: 'asc' | 'desc'
  page: number
  pageSize: number
}

/** One page of data sets; engineers see approved and superseded versions only. */
export async function listDataSets(db: Db, user: SessionUser, o: ListOptions) {
  let states = o.state
  if (!readsEverything(user)) states = (states ?? [...PUBLISHED_STATES]).filter((s) => PUBLISHED_STATES.includes(s))
  if (states && states.length === 0) return { items: [], total: 0, page: o.page, pageSize: o.pageSize }
  const r = await repo.listDataSets(db, { ...o, states, ...pageWindow(o.page, o.pageSize) })
  return { ...r, page: o.page, pageSize: o.pageSize }
}

/** Everything about one version: system, points, fits, consistency, comments, uploads, signatures, versions. */
export async function getDataSetDetail(db: Db, user: SessionUser, id: string) {
  const d = visibleOrNotFound(user, await repo.findDataSet(db, id))
  const full = readsEverything(user)
  const pts = await points.listPoints(db, id)
  // Every derived result says which point set it was computed on and whether that is still the current one.
  const pointSet = pointSetOf(pts, d.vaporModel)
  const system = await getSystem(db, d.systemId)
  const fits = await listFits(db, id)
  return {
    ...d,
    pointSetDigest: pointSet.digest,
    includedPointCount: pointSet.included,
    system,
    points: pts,
    fits: fits.map((f) => withStale(f, pointSet.digest)),
    consistency: (await listConsistency(db, id)).map((c) => withStale(c, pointSet.digest)),
    vapourCorrection: await vapourCorrectionOf(db, d, pts, { system, fits }),
    comments: full ? await listComments(db, id) : [],
    uploads: full ? await listUploadsOf(db, id) : [],
    /** the calibrations behind the points (file, date, model, coefficients ± u, range) */
    calibrations: await calibrationsOfDataSet(db, id),
    approvals: await listApprovals(db, id),
    versions: (await repo.listVersions(db, d.lineageId))
      .filter((v) => full || PUBLISHED_STATES.includes(v.state))
      .map((v) => ({ id: v.id, version: v.version, state: v.state, approvedAt: v.approvedAt })),
  }
}

export async function getPointDetail(db: Db, user: SessionUser, dataSetId: string, pointId: string) {
  visibleOrNotFound(user, await repo.findDataSet(db, dataSetId))
  const p = await points.findPoint(db, pointId)
  if (!p || p.dataSetId !== dataSetId) throw notFound('There is no such point in this data set.')
  return { ...p, injections: await points.listInjections(db, pointId) }
}

export type MetadataPatch = Partial<DataSetInput>

/** Isobaric data keep a nominal pressure and no temperature; isothermal data a temperature (the pressure is optional). */
function nominalCondition(layout: string, P: number | null | undefined, T: number | null | undefined) {
  if (dataKindOf(layout) === 'isobaric') {
    if (P === null || P === undefined) throw conflict('Isobaric data need the nominal pressure.')
    return { nominalPressurePa: P, nominalTemperatureK: null }
  }
  if (T === null || T === undefined) throw conflict('Isothermal data need the temperature they were measured at.')
  return { nominalPressurePa: P ?? null, nominalTemperatureK: T }
}

/**
 * A virial vapour needs both components' critical data (and, under Hayden–O'Connell, their radii of gyration):
 * refuse naming each missing property and its component; then the engine's own check of the assembled model
 * (for instance an association parameter too large for the molecule), as 422 `invalid_vapour_model`.
 */
export async function requireVirialData(db: Db, systemId: string, choice: VaporModelChoice) {
  if (choice.kind !== 'virial') return
  const s = await getSystem(db, systemId)
  const why = missingVirialData([s.component1, s.component2], choice.correlation)
  if (why) throw new AppError(422, 'missing_critical_data', why)
  try {
    checkVaporModel(engineVapor(s, choice))
  } catch (err) {
    if ((err as { name?: string }).name === 'ThermoError')
      throw new AppError(422, 'invalid_vapour_model', (err as Error).message)
    throw err
  }
}

/** Edit metadata of a draft; refused when the caller's row version is stale. */
export async function updateMetadata(
  db: Kysely<Database>,
  user: SessionUser,
  id: string,
  rowVersion: number,
  patch: MetadataPatch,
) {
  return db.transaction().execute(async (tx) => {
    const before = visibleOrNotFound(user, await repo.lockDataSet(tx, id))
    requireState(before, EDITABLE_STATES, 'editing')
    if (before.rowVersion !== rowVersion) throw staleWrite(rowVersion, before.rowVersion)
    await checkSystemChange(tx, before, patch.systemId)
    await checkLayoutChange(tx, before, patch.layout)
    checkOriginAfter({ ...before, ...patch })
    const merged = { ...before, ...patch }
    const nominal = nominalCondition(merged.layout, merged.nominalPressurePa, merged.nominalTemperatureK)
    if (merged.vaporModel.kind === 'virial' && (patch.vaporModel || patch.systemId))
      await requireVirialData(tx, merged.systemId, merged.vaporModel)
    const changedNominal = {
      ...(nominal.nominalPressurePa !== before.nominalPressurePa && { nominalPressurePa: nominal.nominalPressurePa }),
      ...(nominal.nominalTemperatureK !== before.nominalTemperatureK && {
        nominalTemperatureK: nominal.nominalTemperatureK,
      }),
    }
    patch = { ...patch, ...changedNominal }
    const after = await repo.updateDataSet(tx, id, patch, rowVersion)
    if (!after) throw staleWrite(rowVersion, before.rowVersion + 1)
    const changed = Object.keys(patch) as (keyof MetadataPatch)[]
    await appendAudit(tx, {
      actorId: user.id,
      entity: 'data_set',
      entityId: id,
      action: 'update metadata',
      dataSetId: id,
      before: Object.fromEntries(changed.map((k) => [k, before[k]])),
      after: patch,
    })
    return after
  })
}

/** A draft may move to another system only while it has no points (nothing was computed for the old one). */
async function checkSystemChange(db: Db, d: repo.DataSetRecord, systemId: string | undefined) {
  if (systemId === undefined || systemId === d.systemId) return
  if ((await points.listPoints(db, d.id)).length > 0)
    throw conflict('This data set already has points; its system can no longer change. Start a new data set instead.')
  await getSystem(db, systemId)
}

/** The kind of data (layout) may change only while the data set has no points. */
async function checkLayoutChange(db: Db, d: repo.DataSetRecord, layout: string | undefined) {
  if (layout === undefined || layout === d.layout) return
  if ((await points.listPoints(db, d.id)).length > 0)
    throw conflict(
      'This data set already has points; its kind of data can no longer change. Start a new data set instead.',
    )
}

/** The origin rules that span fields, checked on the row as it would be after a change. */
function checkOriginAfter(d: Pick<repo.DataSetRecord, 'origin' | 'citation' | 'originMethod'>) {
  if (d.origin === 'literature' && !d.citation) throw conflict('Literature data needs its full citation.')
  if (d.origin === 'other-method' && !d.originMethod?.trim())
    throw conflict('Say how the compositions were measured (the method other than GC).')
}

/** Exclude a point (a reason is mandatory) or include it again. */
export async function setPointExclusion(
  db: Kysely<Database>,
  user: SessionUser,
  dataSetId: string,
  pointId: string,
  o: { excluded: boolean; reason: string | null; rowVersion: number },
) {
  return db.transaction().execute(async (tx) => {
    const d = visibleOrNotFound(user, await repo.lockDataSet(tx, dataSetId))
    const p = await points.findPoint(tx, pointId)
    if (!p || p.dataSetId !== dataSetId) throw notFound('There is no such point in this data set.')
    requireState(d, EDITABLE_STATES, 'excluding points')
    if (d.rowVersion !== o.rowVersion) throw staleWrite(o.rowVersion, d.rowVersion)
    if (o.excluded && !o.reason?.trim()) throw conflict('Give a reason for excluding this point.')
    const after = await points.setExclusion(tx, pointId, o.excluded, o.reason?.trim() ?? null)
    const ds = await repo.updateDataSet(tx, dataSetId, {})
    await appendAudit(tx, {
      actorId: user.id,
      entity: 'point',
      entityId: pointId,
      action: o.excluded ? 'exclude point' : 'include point',
      dataSetId,
      before: { excluded: p.excluded, reason: p.exclusionReason },
      after: { excluded: after.excluded, reason: after.exclusionReason, sample: p.sampleLabel },
    })
    return { point: after, rowVersion: ds!.rowVersion }
  })
}

/** Delete a draft that was never submitted. */
export async function deleteDraft(db: Kysely<Database>, user: SessionUser, id: string) {
  await db.transaction().execute(async (tx) => {
    const d = visibleOrNotFound(user, await repo.lockDataSet(tx, id))
    if (d.createdBy !== user.id && !user.roles.includes('lead_chemist'))
      throw forbidden('Only the author of this draft or a lead chemist may delete it.')
    requireState(d, ['draft'], 'deleting')
    if (d.submittedAt) throw conflict('This data set has been submitted before; it is kept for the record.')
    if ((await jointFitsWith(tx, id)).length)
      throw conflict("This draft is part of a joint fit on its system's page; delete that joint fit first.")
    await appendAudit(tx, {
      actorId: user.id,
      entity: 'data_set',
      entityId: id,
      action: 'delete draft',
      before: { title: d.title, version: d.version, createdBy: d.createdBy, systemId: d.systemId },
    })
    await repo.deleteDataSet(tx, id)
  })
}

/** "Revise": a new draft version of an approved data set, carrying its points (and fits) over. */
export async function reviseDataSet(db: Kysely<Database>, user: SessionUser, id: string) {
  return db.transaction().execute(async (tx) => {
    const d = visibleOrNotFound(user, await repo.lockDataSet(tx, id))
    requireState(d, ['approved'], 'revising')
    const versions = await repo.listVersions(tx, d.lineageId)
    const open = versions.find((v) => !PUBLISHED_STATES.includes(v.state))
    if (open)
      throw conflict(`Version ${open.version} of this data set is already being worked on (${open.state}).`, {
        dataSetId: open.id,
      })
    const next = await repo.insertDataSet(tx, {
      lineageId: d.lineageId,
      version: Math.max(...versions.map((v) => v.version)) + 1,
      previousVersionId: d.id,
      systemId: d.systemId,
      title: d.title,
      nominalPressurePa: d.nominalPressurePa,
      apparatusNotes: d.apparatusNotes,
      projectRef: d.projectRef,
      createdBy: user.id,
      origin: d.origin,
      originMethod: d.originMethod,
      citation: d.citation,
      layout: d.layout,
      nominalTemperatureK: d.nominalTemperatureK,
      vaporModel: d.vaporModel,
      countsAsOwn: d.countsAsOwn,
      countsAsOwnBy: d.countsAsOwnBy,
      countsAsOwnReason: d.countsAsOwnReason,
    })
    const pointMap = await points.copyPoints(tx, d.id, next.id)
    const fitMap = await copyFits(tx, d.id, next.id, pointMap)
    const rec = d.recommendedFitId ? (fitMap.get(d.recommendedFitId) ?? null) : null
    const after = rec ? await repo.updateDataSet(tx, next.id, { recommendedFitId: rec }) : next
    await appendAudit(tx, {
      actorId: user.id,
      entity: 'data_set',
      entityId: next.id,
      action: 'revise',
      dataSetId: next.id,
      after: { fromVersion: d.version, version: next.version, points: pointMap.size, fits: fitMap.size },
    })
    return after!
  })
}

/** The whole lineage's audit trail, oldest first. */
export async function auditTrail(db: Db, user: SessionUser, id: string) {
  const d = visibleOrNotFound(user, await repo.findDataSet(db, id))
  return listAuditForLineage(db, d.lineageId)
}

/** A lead chemist marks a literature data set as the lab's own measurement (so it may be approved), or unmarks it. */
export async function setOwnMeasurement(
  db: Kysely<Database>,
  user: SessionUser,
  id: string,
  o: { rowVersion: number; countsAsOwn: boolean; reason: string },
) {
  return db.transaction().execute(async (tx) => {
    const d = visibleOrNotFound(user, await repo.lockDataSet(tx, id))
    requireState(d, FITTABLE_STATES, 'marking the origin')
    if (d.origin !== 'literature')
      throw conflict('Only a literature data set can be marked as the lab’s own measurement.')
    if (d.rowVersion !== o.rowVersion) throw staleWrite(o.rowVersion, d.rowVersion)
    const after = await repo.updateDataSet(tx, id, {
      countsAsOwn: o.countsAsOwn,
      countsAsOwnBy: o.countsAsOwn ? user.id : null,
      countsAsOwnReason: o.countsAsOwn ? o.reason : null,
    })
    await appendAudit(tx, {
      actorId: user.id,
      entity: 'data_set',
      entityId: id,
      action: o.countsAsOwn ? 'mark as own measurement' : 'unmark own measurement',
      dataSetId: id,
      before: { countsAsOwn: d.countsAsOwn, reason: d.countsAsOwnReason },
      after: { countsAsOwn: o.countsAsOwn, reason: o.reason },
    })
    return after!
  })
}
