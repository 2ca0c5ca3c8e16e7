/** The analyst's main step: a run sheet previewed with x and y per sample, then committed as points in one transaction. */
import { hasVapour } from '@ebullio/schemas'
import { compositionFromAreas, type Calibration, type CompositionResult } from '@ebullio/thermo'
import type { Kysely } from 'kysely'
import type { SessionUser } from '../auth/index.js'
import type { Config } from '../config.js'
import type { Database, Db } from '../db/index.js'
import { AppError, conflict, notFound } from '../errors/index.js'
import { appendAudit } from '../repositories/audit.repository.js'
import {
  findCalibration,
  findGcMethod,
  listCalibrations,
  summarizeCalibrations,
  type CalibrationRecord,
  type CalibrationSummary,
} from '../repositories/calibrations.repository.js'
import { RETIRED_METHOD_MESSAGE } from './calibrations.service.js'
import * as datasets from '../repositories/datasets.repository.js'
import { insertCheckStandards } from '../repositories/check-standards.repository.js'
import { insertPoints, listPoints, nextSeq } from '../repositories/points.repository.js'
import { findCommittedRun, findUploadContent, insertUpload } from '../repositories/uploads.repository.js'
import { readLimits } from '../uploads/csv-table.js'
import type { ParsedInjection } from '../uploads/calibration-file.js'
import { uploadError, uploadWarning, type UploadProblem } from '../uploads/problems.js'
import {
  DEFAULT_BOUNDS,
  parseRunFileAsync,
  type RunFileParse,
  type RunPhase,
  type RunSample,
} from '../uploads/run-file.js'
import type { RunCheck } from '../uploads/run-checks.js'
import { PHASE_WORDS } from '../uploads/run-layers.js'
import { FIRST_PAGE, pageItems, paging, shownProblems, type PageRequest, type Paging } from './preview-page.js'
import { EDITABLE_STATES, requireState, staleWrite, visibleOrNotFound } from './lab-access.js'
import { assertCommittable, countProblems, summarizeFile, type FileSummary, type UploadedFile } from './upload-files.js'

/** One sample of the preview: SI conditions and the computed compositions with standard uncertainties. */
export interface PreviewSample {
  label: string
  rows: number[]
  temperatureK: number
  pressurePa: number
  x1: number | null
  x1Uncertainty: number | null
  x1Rsd: number | null
  y1: number | null
  y1Uncertainty: number | null
  y1Rsd: number | null
  liquid: ParsedInjection[]
  vapour: ParsedInjection[]
  /** the analyst saw two liquid layers in the still; x1 is then the overall liquid composition */
  heterogeneous: boolean
  /** injections of the separated layers (two-layer samples only) */
  upper: ParsedInjection[]
  lower: ParsedInjection[]
  /** the analysed layers of a two-layer sample, x1I < x1II (null when not analysed or not computable) */
  liquidPhases: [LayerComposition, LayerComposition] | null
  /** injections used of those in the file, per phase; lines whose phase could not be read are listed apart */
  coverage: {
    liquid: { used: number; of: number }
    vapour: { used: number; of: number }
    /** two-layer samples only */
    upper?: { used: number; of: number }
    lower?: { used: number; of: number }
    unreadRows: number[]
  }
  /** lines of this sample with an error: its compositions, if any, come from the other lines only */
  errorRows: number[]
  /** true when some line of the sample was not used or has an error */
  partial: boolean
  /** a sample of one pure component: x1 = y1 = 1 or 0 exactly, not read through the calibration */
  pureComponent: 1 | 2 | null
}

/** A check standard of the run read with the run's calibration: x1 measured − x1 known is its deviation. */
export interface PreviewCheck {
  label: string
  rows: number[]
  knownX1: number
  measuredX1: number
  x1Uncertainty: number
  replicateRsd: number | null
  deviation: number
  injections: ParsedInjection[]
}

/** One analysed liquid layer: x1 with its standard uncertainty and which layer of the still it was. */
export interface LayerComposition {
  x1: number
  uncertainty: number
  rsd: number | null
  layer: 'upper' | 'lower'
}

export interface RunPreview extends Omit<RunFileParse, 'samples' | 'problems' | 'checks'> {
  file: FileSummary
  dataSetId: string
  calibrationId: string
  /** the calibration the compositions are computed with (file, date, model, coefficients ± u, range) */
  calibrationUsed: CalibrationSummary
  /** the requested page of samples; `sampleCount` counts them all */
  samples: PreviewSample[]
  sampleCount: number
  /** every check standard of the file (phase `check`), for the GC method's control chart */
  checks: PreviewCheck[]
  /** the page shown of `rows` and `samples`, with the whole file's row and problem counts */
  paging: Paging
  /** at most PREVIEW_PROBLEMS_MAX problems (errors first); errorCount and warningCount count them all */
  problems: UploadProblem[]
  errorCount: number
  warningCount: number
}

/** The calibration to use: the one asked for, or the only active one for the system. */
async function chooseCalibration(
  db: Db,
  systemId: string,
  calibrationId: string | undefined,
): Promise<CalibrationRecord> {
  if (calibrationId) {
    const c = await findCalibration(db, calibrationId)
    if (!c) throw notFound('There is no such calibration.')
    if (c.systemId !== systemId) throw conflict('This calibration belongs to another binary system.')
    if ((await findGcMethod(db, c.gcMethodId))?.status === 'retired') throw conflict(RETIRED_METHOD_MESSAGE)
    if (c.status !== 'active') throw conflict('This calibration is retired; choose the active one.')
    return c
  }
  const active = await listCalibrations(db, { systemId, status: 'active' })
  if (active.length === 0)
    throw conflict('There is no active calibration for this system; upload a calibration file first.')
  if (active.length > 1)
    throw conflict('Several GC methods have an active calibration for this system; choose one (calibrationId).')
  return active[0]
}

/** The composition of a pure-component sample: exact, with no uncertainty from the calibration. */
const pureComposition = (component: 1 | 2) => ({
  x1: component === 1 ? 1 : 0,
  standardUncertainty: 0,
  replicateRsd: null,
})
type PhaseResult = Pick<CompositionResult, 'x1' | 'standardUncertainty' | 'replicateRsd'>

/** x1 of one phase from its injections, with the problems it raises. */
function phaseComposition(
  cal: CalibrationRecord,
  s: RunSample,
  phase: RunPhase,
  rsdLimit: number,
  problems: UploadProblem[],
): CompositionResult | null {
  const injections = s[phase]
  const name = phase === 'vapour' ? 'y1' : phase === 'liquid' ? 'x1' : `x1 of the ${PHASE_WORDS[phase]}`
  const row = injections[0].row
  let r: CompositionResult
  try {
    r = compositionFromAreas(cal.result as unknown as Calibration, {
      injections: injections.map((i) => ({ area1: i.area1, area2: i.area2 })),
    })
  } catch (err) {
    if ((err as Error).name !== 'ThermoError') throw err
    problems.push(uploadError(row, 'area_1', null, `Sample ${s.label}: ${(err as Error).message}`))
    return null
  }
  if (!(r.x1 >= 0 && r.x1 <= 1)) {
    problems.push(
      uploadError(
        row,
        'area_1',
        null,
        `Sample ${s.label}: the calibration gives ${name} = ${r.x1.toFixed(4)}, outside 0–1.`,
      ),
    )
    return null
  }
  if (r.replicateRsd !== null && r.replicateRsd > rsdLimit) {
    problems.push(
      uploadWarning(
        row,
        'area_1',
        `${(r.replicateRsd * 100).toFixed(2)} %`,
        `Sample ${s.label}, ${PHASE_WORDS[phase]}: replicate area ratios scatter by ${(r.replicateRsd * 100).toFixed(1)} % RSD, above the ${(rsdLimit * 100).toFixed(1)} % limit.`,
      ),
    )
  }
  if (r.outsideCalibratedRange) {
    problems.push(
      uploadWarning(
        row,
        'area_1',
        r.x1.toFixed(4),
        `Sample ${s.label}, ${PHASE_WORDS[phase]}: ${name} = ${r.x1.toFixed(4)} is outside the calibrated range ${cal.rangeMin.toFixed(3)}–${cal.rangeMax.toFixed(3)}.`,
      ),
    )
  }
  return r
}

/**
 * Both layers of a two-layer sample, ordered by x1 (I the poorer in component 1). The overall liquid must lie
 * between them (within 2u): a mass balance over the still that the analyst should see when it fails.
 */
function layerCompositions(
  cal: CalibrationRecord,
  s: RunSample,
  overall: PhaseResult | null,
  rsdLimit: number,
  problems: UploadProblem[],
): [LayerComposition, LayerComposition] | null {
  if (!s.heterogeneous || s.upper.length === 0 || s.lower.length === 0) return null
  const layers = (['upper', 'lower'] as const).map((layer) => {
    const r = phaseComposition(cal, s, layer, rsdLimit, problems)
    return r && { x1: r.x1, uncertainty: r.standardUncertainty, rsd: r.replicateRsd, layer }
  })
  if (!layers[0] || !layers[1]) return null
  const [I, II] = layers[0].x1 <= layers[1].x1 ? [layers[0], layers[1]] : [layers[1], layers[0]]
  if (overall) {
    const u = 2 * Math.hypot(overall.standardUncertainty, Math.max(I.uncertainty, II.uncertainty))
    if (overall.x1 < I.x1 - u || overall.x1 > II.x1 + u) {
      problems.push(
        uploadWarning(
          s.liquid[0].row,
          'area_1',
          overall.x1.toFixed(4),
          `Sample ${s.label}: the overall liquid x1 = ${overall.x1.toFixed(4)} lies outside its two layers (${I.x1.toFixed(4)} and ${II.x1.toFixed(4)}); check the samples.`,
        ),
      )
    }
  }
  return [I, II]
}

/** Each check standard's x1 through the run's calibration; a standard the calibration cannot read is an error. */
function checkResults(cal: CalibrationRecord, checks: RunCheck[], problems: UploadProblem[]): PreviewCheck[] {
  const out: PreviewCheck[] = []
  for (const c of checks) {
    try {
      const r = compositionFromAreas(cal.result as unknown as Calibration, {
        injections: c.injections.map((i) => ({ area1: i.area1, area2: i.area2 })),
      })
      out.push({
        label: c.label,
        rows: c.rows,
        knownX1: c.knownX1,
        measuredX1: r.x1,
        x1Uncertainty: r.standardUncertainty,
        replicateRsd: r.replicateRsd,
        deviation: r.x1 - c.knownX1,
        injections: c.injections,
      })
    } catch (err) {
      if ((err as Error).name !== 'ThermoError') throw err
      problems.push(uploadError(c.firstRow, 'area_1', null, `Check standard ${c.label}: ${(err as Error).message}`))
    }
  }
  return out
}

/** Which of a sample's lines its compositions rest on, so a preview with errors can mark partial samples. */
function coverageOf(
  s: RunSample,
  problems: UploadProblem[],
): Pick<PreviewSample, 'coverage' | 'errorRows' | 'partial'> {
  const lines = new Set(s.rows)
  const errorRows = [
    ...new Set(problems.filter((p) => p.severity === 'error' && p.row !== null && lines.has(p.row)).map((p) => p.row!)),
  ].sort((a, b) => a - b)
  const coverage = {
    liquid: { used: s.liquid.length, of: s.phaseRows.liquid.length },
    vapour: { used: s.vapour.length, of: s.phaseRows.vapour.length },
    ...(s.heterogeneous
      ? {
          upper: { used: s.upper.length, of: s.phaseRows.upper.length },
          lower: { used: s.lower.length, of: s.phaseRows.lower.length },
        }
      : {}),
    unreadRows: s.phaseRows.unknown,
  }
  const partial =
    errorRows.length > 0 ||
    coverage.unreadRows.length > 0 ||
    coverage.liquid.used < coverage.liquid.of ||
    coverage.vapour.used < coverage.vapour.of ||
    s.upper.length < s.phaseRows.upper.length ||
    s.lower.length < s.phaseRows.lower.length
  return { coverage, errorRows, partial }
}

const nextTurn = () => new Promise<void>((resolve) => setImmediate(resolve))

/** The file was already committed to this data set: adding it again would double its points. */
function duplicateMessage(prev: { originalName: string; uploadedAt: Date }): string {
  return `This file was already added to this data set (as "${prev.originalName}", ${prev.uploadedAt.toISOString().slice(0, 16).replace('T', ' ')} UTC); adding it again would count its samples twice.`
}

/** Samples whose label the data set already holds are errors at their first line. */
async function existingLabelProblems(db: Db, dataSetId: string, samples: RunSample[]): Promise<UploadProblem[]> {
  const existing = new Map((await listPoints(db, dataSetId)).map((p) => [p.sampleLabel, p.seq]))
  return samples
    .filter((s) => existing.has(s.label))
    .map((s) =>
      uploadError(
        s.firstRow,
        'sample',
        s.label,
        `Sample ${s.label} is already in this data set (point ${existing.get(s.label)}); give the new sample its own label.`,
      ),
    )
}

/** The whole file analysed: every sample's x and y and every problem (what a commit stores or refuses). */
async function analyseRun(
  db: Db,
  config: Config,
  user: SessionUser,
  dataSetId: string,
  file: UploadedFile,
  calibrationId?: string,
) {
  const d = visibleOrNotFound(user, await datasets.findDataSet(db, dataSetId))
  requireState(d, EDITABLE_STATES, 'uploading')
  const cal = await chooseCalibration(db, d.systemId, calibrationId)
  const summary = summarizeFile(file)
  const liquidOnly = !hasVapour(d.layout)
  const parsed = await parseRunFileAsync(file.content, DEFAULT_BOUNDS, readLimits(config), { liquidOnly })
  const problems = [...parsed.problems]
  const previous = await findCommittedRun(db, dataSetId, summary.sha256)
  if (previous) problems.unshift(uploadError(null, null, null, duplicateMessage(previous)))
  problems.push(...(await existingLabelProblems(db, dataSetId, parsed.samples)))
  const samples: PreviewSample[] = []
  for (const [i, s] of parsed.samples.entries()) {
    if (i % 500 === 499) await nextTurn()
    const pure = s.pureComponent && pureComposition(s.pureComponent)
    const x = pure || phaseComposition(cal, s, 'liquid', config.replicateRsdLimit, problems)
    const y = pure || (liquidOnly ? null : phaseComposition(cal, s, 'vapour', config.replicateRsdLimit, problems))
    const liquidPhases = layerCompositions(cal, s, x, config.replicateRsdLimit, problems)
    samples.push({
      label: s.label,
      rows: s.rows,
      temperatureK: s.temperatureK,
      pressurePa: s.pressurePa,
      x1: x?.x1 ?? null,
      x1Uncertainty: x?.standardUncertainty ?? null,
      x1Rsd: x?.replicateRsd ?? null,
      y1: y?.x1 ?? null,
      y1Uncertainty: y?.standardUncertainty ?? null,
      y1Rsd: y?.replicateRsd ?? null,
      liquid: s.liquid,
      vapour: s.vapour,
      heterogeneous: s.heterogeneous,
      upper: s.upper,
      lower: s.lower,
      liquidPhases,
      ...coverageOf(s, problems),
      pureComponent: s.pureComponent,
    })
  }
  const checks = checkResults(cal, parsed.checks, problems)
  problems.sort((a, b) => (a.row ?? 0) - (b.row ?? 0))
  const { samples: _s, problems: _p, checks: _c, ...rest } = parsed
  return { rest, cal, summary, samples, checks, problems }
}

/**
 * Parse a run sheet and compute every sample's x and y, storing nothing. The answer is bounded: one page of rows
 * and samples, the first problems; the counts cover the whole file.
 */
export async function previewRun(
  db: Db,
  config: Config,
  user: SessionUser,
  dataSetId: string,
  file: UploadedFile,
  calibrationId?: string,
  page: PageRequest = FIRST_PAGE,
): Promise<RunPreview> {
  const { rest, cal, summary, samples, checks, problems } = await analyseRun(
    db,
    config,
    user,
    dataSetId,
    file,
    calibrationId,
  )
  const [calibrationUsed] = await summarizeCalibrations(db, [cal.id])
  return {
    ...rest,
    rows: pageItems(rest.rows, page),
    file: summary,
    dataSetId,
    calibrationId: cal.id,
    calibrationUsed,
    samples: pageItems(samples, page),
    sampleCount: samples.length,
    checks,
    paging: paging(page, rest.rows.length, samples.length, problems.length),
    problems: shownProblems(problems),
    ...countProblems(problems),
  }
}

/** Store the file and every sample as a point, all or nothing; refuses a stale row version. */
export async function commitRun(
  db: Kysely<Database>,
  config: Config,
  user: SessionUser,
  dataSetId: string,
  file: UploadedFile,
  o: { calibrationId?: string; acceptWarnings: boolean; rowVersion: number },
) {
  const sha256 = summarizeFile(file).sha256
  const refuseDuplicate = async (q: Db) => {
    const previous = await findCommittedRun(q, dataSetId, sha256)
    if (previous) throw new AppError(409, 'duplicate_upload', duplicateMessage(previous), { sha256 })
  }
  visibleOrNotFound(user, await datasets.findDataSet(db, dataSetId))
  await refuseDuplicate(db)
  const analysed = await analyseRun(db, config, user, dataSetId, file, o.calibrationId)
  const preview = { ...analysed, file: analysed.summary, calibrationId: analysed.cal.id }
  assertCommittable(preview.problems, o.acceptWarnings)
  return db.transaction().execute(async (tx) => {
    const d = await datasets.lockDataSet(tx, dataSetId)
    if (!d) throw notFound('There is no such data set.')
    requireState(d, EDITABLE_STATES, 'uploading')
    if (d.rowVersion !== o.rowVersion) throw staleWrite(o.rowVersion, d.rowVersion)
    // under the data set's lock: two commits of the same file at once cannot both pass
    await refuseDuplicate(tx)
    const upload = await insertUpload(tx, {
      kind: 'run',
      originalName: file.originalName,
      contentType: file.contentType,
      content: file.content,
      sha256: preview.file.sha256,
      uploadedBy: user.id,
      dataSetId,
    })
    const first = await nextSeq(tx, dataSetId)
    const ids = await insertPoints(
      tx,
      dataSetId,
      first,
      preview.samples.map((s) => ({
        sampleLabel: s.label,
        temperatureK: s.temperatureK,
        pressurePa: s.pressurePa,
        x1: s.x1!,
        x1Uncertainty: s.x1Uncertainty!,
        // null for T–x and P–x data (no vapour analysed)
        y1: s.y1,
        y1Uncertainty: s.y1 === null ? null : s.y1Uncertainty,
        uploadId: upload.id,
        calibrationId: preview.calibrationId,
        rowRefs: s.rows,
        heterogeneous: s.heterogeneous,
        liquidPhases: s.liquidPhases && [
          { x1: s.liquidPhases[0].x1, uncertainty: s.liquidPhases[0].uncertainty },
          { x1: s.liquidPhases[1].x1, uncertainty: s.liquidPhases[1].uncertainty },
        ],
        injections: [
          ...s.liquid.map((i) => ({ ...i, phase: 'liquid' as const })),
          ...s.vapour.map((i) => ({ ...i, phase: 'vapour' as const })),
          ...s.upper.map((i) => ({ ...i, phase: 'upper' as const })),
          ...s.lower.map((i) => ({ ...i, phase: 'lower' as const })),
        ],
      })),
    )
    const checkIds = await insertCheckStandards(
      tx,
      preview.checks.map((c) => ({
        gcMethodId: preview.cal.gcMethodId,
        calibrationId: preview.calibrationId,
        uploadId: upload.id,
        dataSetId,
        label: c.label,
        knownX1: c.knownX1,
        measuredX1: c.measuredX1,
        x1Uncertainty: c.x1Uncertainty,
        replicateRsd: c.replicateRsd,
        injections: c.injections,
        rowRefs: c.rows,
        recordedBy: user.id,
      })),
    )
    const after = await datasets.updateDataSet(tx, dataSetId, {})
    await appendAudit(tx, {
      actorId: user.id,
      entity: 'upload',
      entityId: upload.id,
      action: 'upload run file',
      dataSetId,
      after: {
        ...preview.file,
        points: ids.length,
        checkStandards: checkIds.length,
        calibrationId: preview.calibrationId,
        acceptedWarnings: countProblems(preview.problems).warningCount,
      },
    })
    return {
      uploadId: upload.id,
      pointIds: ids,
      pointCount: ids.length,
      checkStandardIds: checkIds,
      rowVersion: after!.rowVersion,
      sha256: preview.file.sha256,
    }
  })
}

/** The stored file exactly as received, for tracing any number back to its raw peak areas. */
export async function downloadUpload(db: Db, user: SessionUser, id: string) {
  const u = await findUploadContent(db, id)
  if (!u) throw notFound('There is no such file.')
  if (u.data_set_id) visibleOrNotFound(user, await datasets.findDataSet(db, u.data_set_id))
  return { name: u.original_name, contentType: u.content_type, content: u.content, sha256: u.sha256 }
}
