/** GC methods and calibrations: a calibration sheet is previewed, fitted by thermo, then committed in one transaction. */
import { fitCalibration, type Calibration, type CalibrationModel } from '@ebullio/thermo'
import type { Kysely } from 'kysely'
import type { Database, Db } from '../db/index.js'
import { AppError, conflict, notFound } from '../errors/index.js'
import { appendAudit } from '../repositories/audit.repository.js'
import * as repo from '../repositories/calibrations.repository.js'
import { findDataSet } from '../repositories/datasets.repository.js'
import { insertUpload } from '../repositories/uploads.repository.js'
import { parseCalibrationFileAsync, type CalibrationFileParse } from '../uploads/calibration-file.js'
import { DEFAULT_READ_LIMITS, readLimits, type ReadLimits } from '../uploads/csv-table.js'
import type { Config } from '../config.js'
import { FIRST_PAGE, pageItems, paging, shownProblems, type PageRequest, type Paging } from './preview-page.js'
import { uploadError, uploadWarning, type UploadProblem } from '../uploads/problems.js'
import { EDITABLE_STATES, requireState, translateDbError } from './lab-access.js'
import { getSystem } from './systems.service.js'
import { assertCommittable, countProblems, summarizeFile, type FileSummary, type UploadedFile } from './upload-files.js'

/** Refusal of a commit that would replace an active calibration without saying so (asserted word for word in the tests). */
export const REPLACE_NOT_CONFIRMED_MESSAGE =
  'This GC method already has an active calibration for this system; confirm that the new one replaces it (replaceActive), or choose another GC method.'

/** Refusal for a retired method's calibrations (asserted word for word in the tests). */
export const RETIRED_METHOD_MESSAGE =
  'This GC method is retired: its calibrations cannot be made active or used for new uploads.'

export async function createGcMethod(
  db: Db,
  actorId: string,
  m: Omit<repo.GcMethodRecord, 'id' | 'createdAt' | 'status' | 'retiredAt'>,
): Promise<repo.GcMethodRecord> {
  try {
    const method = await repo.insertGcMethod(db, m, actorId)
    await appendAudit(db, { actorId, entity: 'gc_method', entityId: method.id, action: 'create', after: m })
    return method
  } catch (err) {
    return translateDbError(err, { gc_method_name_key: 'A GC method with this name already exists.' })
  }
}

export interface CalibrationPreview extends Omit<CalibrationFileParse, 'problems'> {
  file: FileSummary
  gcMethodId: string
  systemId: string
  model: CalibrationModel
  calibration: Calibration | null
  /** the active calibration of this method and system that committing would retire, null when there is none */
  replaces: repo.CalibrationSummary | null
  /** the requested page of standards; `standardCount` counts them all */
  standardCount: number
  /** the page shown of `rows` and `standards`, with the whole file's row and problem counts */
  paging: Paging
  /** at most PREVIEW_PROBLEMS_MAX problems (errors first); errorCount and warningCount count them all */
  problems: UploadProblem[]
  errorCount: number
  warningCount: number
}

/** How a calibration commit was asked for: the replacement acknowledged, and the data set it was made from. */
export interface CalibrationCommitOptions {
  /** true when the person saw and accepted that the active calibration of this method and system is retired */
  replaceActive?: boolean
  /** the data set whose upload dialog made it: the commit goes into that data set's audit trail too */
  dataSetId?: string | null
  /** the server's read limits (UPLOAD_MAX_ROWS); the defaults otherwise */
  limits?: ReadLimits
}

/** The active calibration a new one would replace, described for the person who decides. */
async function activeSummary(db: Db, gcMethodId: string, systemId: string): Promise<repo.CalibrationSummary | null> {
  const active = await repo.findActiveCalibration(db, gcMethodId, systemId)
  return active ? ((await repo.summarizeCalibrations(db, [active.id]))[0] ?? null) : null
}

export interface CalibrationRequest {
  gcMethodId: string
  systemId: string
  model: CalibrationModel
}

/**
 * Parse and fit a calibration sheet without storing anything. The answer is bounded: one page of rows and
 * standards, the first problems; the counts cover the whole file.
 */
export async function previewCalibration(
  db: Db,
  config: Pick<Config, 'uploadMaxRows'>,
  req: CalibrationRequest,
  file: UploadedFile,
  page: PageRequest = FIRST_PAGE,
): Promise<CalibrationPreview> {
  const full = await analyseCalibration(db, req, file, readLimits(config))
  return {
    ...full,
    rows: pageItems(full.rows, page),
    standards: pageItems(full.standards, page),
    standardCount: full.standards.length,
    paging: paging(page, full.rows.length, full.standards.length, full.problems.length),
    problems: shownProblems(full.problems),
  }
}

/** The whole sheet parsed and fitted, every problem listed (what a commit stores or refuses). */
async function analyseCalibration(db: Db, req: CalibrationRequest, file: UploadedFile, limits: ReadLimits) {
  const method = await repo.findGcMethod(db, req.gcMethodId)
  if (!method) throw notFound('There is no such GC method.')
  if (method.status === 'retired') throw conflict(RETIRED_METHOD_MESSAGE)
  const system = await getSystem(db, req.systemId)
  const parsed = await parseCalibrationFileAsync(file.content, limits)
  const problems = [...parsed.problems]
  let calibration: Calibration | null = null
  if (problems.length === 0) {
    try {
      calibration = fitCalibration({
        model: req.model,
        molarMasses: [system.component1.molarMass, system.component2.molarMass],
        standards: parsed.standards.map((s) => ({
          label: s.label,
          composition: s.basis === 'mass' ? { w1: s.fraction1 } : { x1: s.fraction1 },
          injections: s.injections.map((i) => ({ area1: i.area1, area2: i.area2 })),
        })),
      })
      for (const w of calibration.warnings) problems.push(uploadWarning(null, null, null, w))
    } catch (err) {
      if ((err as Error).name !== 'ThermoError') throw err
      problems.push(uploadError(null, null, null, `The calibration could not be fitted: ${(err as Error).message}`))
    }
  }
  const replaces = await activeSummary(db, req.gcMethodId, req.systemId)
  return { ...parsed, ...req, file: summarizeFile(file), calibration, replaces, problems, ...countProblems(problems) }
}

/**
 * Store the file, the standards and the fitted calibration (all or nothing); it becomes the active one.
 * Replacing the active calibration of the same method and system must be acknowledged (`replaceActive`):
 * it changes what every later upload on that method computes with, for the whole lab.
 */
export async function commitCalibration(
  db: Kysely<Database>,
  actorId: string,
  req: CalibrationRequest,
  file: UploadedFile,
  acceptWarnings: boolean,
  o: CalibrationCommitOptions = {},
): Promise<repo.CalibrationRecord> {
  const dataSetId = o.dataSetId ?? null
  if (dataSetId) {
    const d = await findDataSet(db, dataSetId)
    if (!d) throw notFound('There is no such data set.')
    if (d.systemId !== req.systemId)
      throw conflict('This calibration belongs to another binary system than the data set.')
    requireState(d, EDITABLE_STATES, 'uploading')
  }
  const preview = await analyseCalibration(db, req, file, o.limits ?? DEFAULT_READ_LIMITS)
  assertCommittable(preview.problems, acceptWarnings)
  const cal = preview.calibration!
  return db.transaction().execute(async (tx) => {
    // the method may have been retired since the preview above; the row lock makes the check and the insert one step
    const locked = await repo.lockGcMethod(tx, req.gcMethodId)
    if (locked?.status === 'retired') throw conflict(RETIRED_METHOD_MESSAGE)
    // checked again under the lock: someone may have committed another calibration since the preview
    const replaces = await activeSummary(tx, req.gcMethodId, req.systemId)
    if (replaces && !o.replaceActive)
      throw new AppError(409, 'replacement_not_confirmed', REPLACE_NOT_CONFIRMED_MESSAGE, { replaces })
    const upload = await insertUpload(tx, {
      kind: 'calibration',
      originalName: file.originalName,
      contentType: file.contentType,
      content: file.content,
      sha256: preview.file.sha256,
      uploadedBy: actorId,
      dataSetId: null,
    })
    const retired = await repo.retireActive(tx, req.gcMethodId, req.systemId)
    const record = await repo.insertCalibration(tx, {
      ...req,
      result: cal,
      rangeMin: cal.calibratedRange.x1[0],
      rangeMax: cal.calibratedRange.x1[1],
      uploadId: upload.id,
      createdBy: actorId,
      standards: preview.standards.map((s, i) => ({
        label: s.label,
        basis: s.basis,
        fraction1: s.fraction1,
        x1: cal.residuals[i].x1,
        injections: s.injections,
      })),
    })
    await appendAudit(tx, {
      actorId,
      entity: 'upload',
      entityId: upload.id,
      action: 'upload calibration file',
      dataSetId,
      after: preview.file,
    })
    for (const id of retired) {
      await appendAudit(tx, {
        actorId,
        entity: 'calibration',
        entityId: id,
        action: 'retire',
        dataSetId,
        after: {
          replacedBy: record.id,
          ...(replaces?.id === id && {
            file: replaces.originalName,
            madeAt: replaces.createdAt,
            usedByDataSets: replaces.dataSetCount,
          }),
        },
      })
    }
    await appendAudit(tx, {
      actorId,
      entity: 'calibration',
      entityId: record.id,
      action: 'create',
      dataSetId,
      after: {
        model: req.model,
        coefficients: cal.coefficients,
        standardErrors: cal.standardErrors,
        range: cal.calibratedRange.x1,
        file: file.originalName,
        replaces: retired,
      },
    })
    return record
  })
}

export async function getCalibration(db: Db, id: string) {
  const c = await repo.findCalibration(db, id)
  if (!c) throw notFound('There is no such calibration.')
  return { ...c, standards: await repo.listStandards(db, id) }
}

export async function retireCalibration(db: Db, actorId: string, id: string): Promise<void> {
  const c = await repo.findCalibration(db, id)
  if (!c) throw notFound('There is no such calibration.')
  if (c.status === 'retired') throw conflict('This calibration is already retired.')
  await repo.retireCalibration(db, id)
  await appendAudit(db, { actorId, entity: 'calibration', entityId: id, action: 'retire' })
}

/**
 * Retire a GC method: its active calibrations are retired with it (one transaction, each audited), so no
 * new upload can use them; the calibrations and the points computed with them stay for the record.
 */
export async function retireGcMethod(db: Kysely<Database>, actorId: string, id: string): Promise<repo.GcMethodRecord> {
  return db.transaction().execute(async (tx) => {
    const m = await repo.lockGcMethod(tx, id)
    if (!m) throw notFound('There is no such GC method.')
    if (m.status === 'retired') throw conflict('This GC method is already retired.')
    const calibrationIds = await repo.retireMethodCalibrations(tx, id)
    for (const c of calibrationIds)
      await appendAudit(tx, {
        actorId,
        entity: 'calibration',
        entityId: c,
        action: 'retire',
        after: { reason: 'GC method retired' },
      })
    const method = await repo.retireGcMethod(tx, id, actorId)
    await appendAudit(tx, {
      actorId,
      entity: 'gc_method',
      entityId: id,
      action: 'retire',
      after: { retiredCalibrations: calibrationIds.length },
    })
    return method
  })
}

/** Pages of GC methods and calibrations, answered by the repository as they are (no rule applies). */
export { listCalibrationsPage, listGcMethodsPage } from '../repositories/calibrations.repository.js'
