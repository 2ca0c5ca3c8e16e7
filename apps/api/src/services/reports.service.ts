/**
 * The signed report: a printable PDF of one data set version, registered with a report id that leads to the
 * verify page, and the verification itself (the digest printed then against the stored record now).
 */
import { webLink } from '@ebullio/schemas'
import { phaseDiagram, type ActivityModel } from '@ebullio/thermo'
import type { SessionUser } from '../auth/index.js'
import type { Config } from '../config.js'
import type { Db } from '../db/index.js'
import { notFound } from '../errors/index.js'
import { listApprovals } from '../repositories/approvals.repository.js'
import { calibrationsOfDataSet, findGcMethod } from '../repositories/calibrations.repository.js'
import { listComments } from '../repositories/comments.repository.js'
import * as repo from '../repositories/datasets.repository.js'
import { listConsistency, listFits } from '../repositories/fits.repository.js'
import { listPoints } from '../repositories/points.repository.js'
import { findReport, insertReport } from '../repositories/reports.repository.js'
import { cautionFor } from './catalogue.service.js'
import { contentDigest } from './digest.js'
import { computedOn, pointSetOf, withStale } from './point-set.js'
import { fileStem, TEMPERATURE_FORM } from './exports.service.js'
import { recommendedSetOf } from './joint-fit-signing.js'
import { visibleOrNotFound } from './lab-access.js'
import { reportPdf } from './report/report-pdf.js'
import type { ReportCurve, ReportModel } from './report/report-model.js'
import { binarySystem, engineInputs } from './systems.service.js'

/** The page of the web app that verifies a report. */
export const verifyUrl = (config: Config, reportId: string) =>
  webLink(config.publicUrl, 'verifyReport', { id: reportId })

/** Generate, register and render the report of a data set version. */
export async function generateReport(
  db: Db,
  config: Config,
  user: SessionUser,
  id: string,
): Promise<{ name: string; pdf: Buffer; reportId: string }> {
  const d = visibleOrNotFound(user, await repo.findDataSet(db, id))
  const digest = await contentDigest(db, id)
  const approvals = await listApprovals(db, id)
  const reportId = await insertReport(db, {
    dataSetId: id,
    dataSetVersion: d.version,
    dataSetState: d.state,
    contentDigest: digest,
    approvalId: approvals.at(-1)?.id ?? null,
    generatedBy: user.id,
  })
  const registered = (await findReport(db, reportId))!
  const model = await gatherReport(db, d, digest, approvals)
  const pdf = await reportPdf({
    ...model,
    report: {
      id: reportId,
      number: registered.number,
      generatedAt: registered.generatedAt,
      generatedBy: user.displayName,
      verifyUrl: verifyUrl(config, reportId),
      labName: config.labName,
      timeZone: config.reportTimeZone,
    },
  })
  return { name: `${fileStem(d)}-report-${registered.number}.pdf`, pdf, reportId }
}

/** Everything the report prints, from the stored record. */
async function gatherReport(
  db: Db,
  d: repo.DataSetRecord,
  digest: string,
  approvals: Awaited<ReturnType<typeof listApprovals>>,
): Promise<Omit<ReportModel, 'report'>> {
  const inputs = await engineInputs(db, d.systemId)
  const calibrations = await calibrationsOfDataSet(db, d.id)
  const methodIds = [...new Set(calibrations.map((c) => c.gcMethodId))]
  const gcMethods = (await Promise.all(methodIds.map((m) => findGcMethod(db, m)))).filter((m) => m !== undefined)
  const points = await listPoints(db, d.id)
  // the data set's vapour model is part of its point set (a virial set's fits were stored with it)
  const current = pointSetOf(points, d.vaporModel).digest
  const fits = (await listFits(db, d.id)).map((f) => withStale(f, current))
  const { curve, curveNote } = recommendedCurve(d, fits, inputs)
  const c = (x: typeof inputs.system.component1) => ({ name: x.name, cas: x.casNumber, formula: x.formula })
  return {
    dataSet: d,
    system: {
      name: inputs.system.name,
      component1: c(inputs.system.component1),
      component2: c(inputs.system.component2),
      notes: inputs.system.notes,
    },
    vaporPressure: inputs.vaporPressureSets.map((s, i) => ({
      component: i === 0 ? inputs.system.component1.name : inputs.system.component2.name,
      kind: String(s.parameters.kind ?? 'correlation'),
      source: s.source,
    })),
    gcMethods,
    calibrations,
    points,
    fits,
    consistency: (await listConsistency(db, d.id)).map((c) => withStale(c, current)),
    pointSetDigest: current,
    curve,
    curveNote,
    comments: await listComments(db, d.id),
    approvals,
    digest,
    outlierIds: [...approvals].reverse().find((a) => a.meaning === 'approved')?.outliers?.pointIds ?? [],
    caution: cautionFor(d.vaporModel),
    recommendedSet: await reportedSystemSet(db, d.systemId),
  }
}

/** The system's signed recommended parameter set with its temperature form and the caution worded for its vapour. */
async function reportedSystemSet(db: Db, systemId: string): Promise<ReportModel['recommendedSet']> {
  const r = await recommendedSetOf(db, systemId)
  if (!r) return null
  return { ...r, temperatureForm: TEMPERATURE_FORM[r.model] ?? null, caution: cautionFor(r.vaporModel) }
}

function recommendedCurve(
  d: repo.DataSetRecord,
  fits: (Awaited<ReturnType<typeof listFits>>[number] & { stale: boolean })[],
  inputs: Awaited<ReturnType<typeof engineInputs>>,
): { curve: ReportCurve | null; curveNote: string | null } {
  const fit = fits.find((f) => f.id === d.recommendedFitId)
  if (!fit)
    return { curve: null, curveNote: 'No fit is marked as recommended: the plots show the measured points only.' }
  const condition =
    d.nominalTemperatureK !== null
      ? { T: d.nominalTemperatureK }
      : d.nominalPressurePa !== null
        ? { P: d.nominalPressurePa }
        : null
  if (!condition)
    return {
      curve: null,
      curveNote:
        'This isothermal data set has no nominal temperature recorded: the plots show the measured points only.',
    }
  try {
    // drawn under the vapour the fit was made with
    const vapor = (fit.options.vapor as typeof inputs.vapor | undefined) ?? inputs.vapor
    const diagram = phaseDiagram(
      binarySystem({ ...inputs, vapor }, fit.activity as unknown as ActivityModel),
      condition,
    )
    return {
      curve: {
        fitId: fit.id,
        model: fit.model,
        x1: diagram.x1,
        y1: diagram.y1,
        T: diagram.kind === 'isobaric' ? diagram.T : [],
        P: diagram.kind === 'isothermal' ? diagram.P : undefined,
      },
      curveNote: fit.stale
        ? `STALE: the recommended fit was ${computedOn(fit)}, not on the points this report lists; run it again before relying on the curve.`
        : null,
    }
  } catch (e) {
    return { curve: null, curveNote: `The recommended fit's curve could not be computed: ${(e as Error).message}` }
  }
}

/** The verify page's answer: the report as registered, and whether the stored record still has the digest it printed. */
export async function verifyReport(db: Db, user: SessionUser, reportId: string) {
  const r = await findReport(db, reportId)
  if (!r) throw notFound('There is no such report.')
  const d = visibleOrNotFound(user, await repo.findDataSet(db, r.dataSetId))
  const currentDigest = await contentDigest(db, d.id)
  const approvals = await listApprovals(db, d.id)
  return {
    report: {
      id: r.id,
      number: r.number,
      generatedAt: r.generatedAt,
      generatedBy: r.generatedByName,
      dataSetVersion: r.dataSetVersion,
      dataSetState: r.dataSetState,
      digest: r.contentDigest,
    },
    dataSet: { id: d.id, title: d.title, version: d.version, state: d.state },
    currentDigest,
    matches: currentDigest === r.contentDigest,
    signatures: approvals.map((a) => ({
      signerName: a.signerName,
      meaning: a.meaning,
      signedAt: a.signedAt,
      digest: a.digest,
      matches: a.digest === currentDigest,
    })),
  }
}
