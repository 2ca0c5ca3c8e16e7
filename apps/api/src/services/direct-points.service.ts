/**
 * Points that did not come through the GC path: typed into the grid or read from Ebullio's point sheet
 * (legacy series, another analytical method, literature tables). All or nothing: one bad row or cell
 * refuses the whole batch with every problem named, and nothing is stored.
 */
import { hasVapour, type DirectPoint } from '@ebullio/schemas'
import type { Kysely } from 'kysely'
import type { SessionUser } from '../auth/index.js'
import type { Database } from '../db/index.js'
import { AppError, conflict } from '../errors/index.js'
import { appendAudit } from '../repositories/audit.repository.js'
import * as datasets from '../repositories/datasets.repository.js'
import { insertPoints, listPoints, nextSeq } from '../repositories/points.repository.js'
import { insertUpload } from '../repositories/uploads.repository.js'
import { parsePointSheet, type SheetPoint } from '../uploads/point-sheet.js'
import { uploadError, type UploadProblem } from '../uploads/problems.js'
import { EDITABLE_STATES, requireState, staleWrite, visibleOrNotFound } from './lab-access.js'
import { assertCommittable, countProblems, summarizeFile, type UploadedFile } from './upload-files.js'

type DataSetRecord = datasets.DataSetRecord

/** Direct points belong to data sets whose numbers did not come from this lab's GC. */
function requireDirectOrigin(d: DataSetRecord) {
  if (d.origin === 'gc')
    throw conflict(
      'This data set is measured here by GC: its points come from run files. Set its origin to "measured here by another method" or "literature" to enter points directly.',
    )
}

/** Problems a batch has against the data set: layout (y1 present or not) and labels already used. */
function batchProblems(d: DataSetRecord, pts: (DirectPoint & { row: number | null })[], used: Set<string>) {
  const problems: UploadProblem[] = []
  const seen = new Set<string>()
  for (const p of pts) {
    if (used.has(p.sampleLabel) || seen.has(p.sampleLabel))
      problems.push(
        uploadError(p.row, 'sample', p.sampleLabel, `Sample "${p.sampleLabel}" is already used in this data set.`),
      )
    seen.add(p.sampleLabel)
    if (hasVapour(d.layout) && p.y1 === null) problems.push(uploadError(p.row, 'y1', null, 'y1 is missing.'))
    if (!hasVapour(d.layout) && p.y1 !== null)
      problems.push(
        uploadError(
          p.row,
          'y1',
          String(p.y1),
          `A ${d.layout === 'px' ? 'P–x' : 'T–x'} data set has no vapour composition; leave y1 empty.`,
        ),
      )
    if (p.y1 !== null && p.y1Uncertainty === null)
      problems.push(uploadError(p.row, 'u_y1', null, 'Give u(y1) with y1.'))
  }
  return problems
}

async function store(
  tx: Kysely<Database>,
  user: SessionUser,
  d: DataSetRecord,
  pts: (DirectPoint & { row: number | null })[],
  uploadId: string | null,
  action: string,
  extra: Record<string, unknown>,
) {
  const first = await nextSeq(tx, d.id)
  const ids = await insertPoints(
    tx,
    d.id,
    first,
    pts.map((p) => ({
      sampleLabel: p.sampleLabel,
      temperatureK: p.temperatureK,
      pressurePa: p.pressurePa,
      x1: p.x1,
      x1Uncertainty: p.x1Uncertainty,
      // T–x and P–x points have neither y1 nor its uncertainty
      y1: p.y1,
      y1Uncertainty: p.y1 === null ? null : p.y1Uncertainty,
      pressureUncertaintyPa: p.pressureUncertaintyPa ?? null,
      uploadId,
      calibrationId: null,
      rowRefs: p.row === null ? [] : [p.row],
      injections: [],
    })),
  )
  const after = await datasets.updateDataSet(tx, d.id, {})
  await appendAudit(tx, {
    actorId: user.id,
    entity: 'data_set',
    entityId: d.id,
    action,
    dataSetId: d.id,
    after: { points: ids.length, origin: d.origin, samples: pts.map((p) => p.sampleLabel), ...extra },
  })
  return { pointIds: ids, rowVersion: after!.rowVersion }
}

async function lockEditable(tx: Kysely<Database>, user: SessionUser, id: string, rowVersion: number) {
  const d = visibleOrNotFound(user, await datasets.lockDataSet(tx, id))
  requireState(d, EDITABLE_STATES, 'adding points')
  requireDirectOrigin(d)
  if (d.rowVersion !== rowVersion) throw staleWrite(rowVersion, d.rowVersion)
  return d
}

function refuse(problems: UploadProblem[]): never {
  throw new AppError(
    422,
    'points_rejected',
    `${problems.length} problem${problems.length === 1 ? '' : 's'} in the points; nothing was stored.`,
    problems,
  )
}

/** Points typed into the grid (row = position in the grid, 1-based). */
export async function addTypedPoints(
  db: Kysely<Database>,
  user: SessionUser,
  id: string,
  o: { rowVersion: number; points: DirectPoint[] },
) {
  return db.transaction().execute(async (tx) => {
    const d = await lockEditable(tx, user, id, o.rowVersion)
    const used = new Set((await listPoints(tx, id)).map((p) => p.sampleLabel))
    const pts = o.points.map((p, i) => ({ ...p, row: i + 1 }))
    const problems = batchProblems(d, pts, used)
    if (problems.length) refuse(problems)
    return store(tx, user, d, pts, null, 'enter points', {})
  })
}

/** Read a point sheet against a data set; stores nothing. */
export async function previewPointSheet(db: Kysely<Database>, user: SessionUser, id: string, file: UploadedFile) {
  const d = visibleOrNotFound(user, await datasets.findDataSet(db, id))
  requireDirectOrigin(d)
  const parsed = parsePointSheet(file.content, d.layout)
  const used = new Set((await listPoints(db, id)).map((p) => p.sampleLabel))
  const problems = [...parsed.problems, ...batchProblems(d, parsed.points.map(asDirect), used)]
  return { file: summarizeFile(file), ...parsed, problems, ...countProblems(problems) }
}

/** Store a point sheet (file as received, points, audit) in one transaction, or nothing. */
export async function commitPointSheet(
  db: Kysely<Database>,
  user: SessionUser,
  id: string,
  file: UploadedFile,
  rowVersion: number,
) {
  return db.transaction().execute(async (tx) => {
    const d = await lockEditable(tx, user, id, rowVersion)
    const parsed = parsePointSheet(file.content, d.layout)
    const used = new Set((await listPoints(tx, id)).map((p) => p.sampleLabel))
    const pts = parsed.points.map(asDirect)
    assertCommittable([...parsed.problems, ...batchProblems(d, pts, used)], false)
    const summary = summarizeFile(file)
    const upload = await insertUpload(tx, {
      kind: 'points',
      originalName: file.originalName,
      contentType: file.contentType,
      content: file.content,
      sha256: summary.sha256,
      uploadedBy: user.id,
      dataSetId: id,
    })
    return {
      uploadId: upload.id,
      ...(await store(tx, user, d, pts, upload.id, 'import point sheet', {
        file: summary.name,
        sha256: summary.sha256,
      })),
    }
  })
}

const asDirect = (p: SheetPoint): DirectPoint & { row: number | null } => ({ ...p })
