/** Exports in Ebullio's own documented layouts (docs/csv-formats.md): points CSV, parameters JSON and CSV. */
import type { SessionUser } from '../auth/index.js'
import type { Db } from '../db/index.js'
import { listApprovals } from '../repositories/approvals.repository.js'
import * as repo from '../repositories/datasets.repository.js'
import { listFits } from '../repositories/fits.repository.js'
import { listPoints } from '../repositories/points.repository.js'
import { visibleOrNotFound } from './lab-access.js'
import { engineInputs } from './systems.service.js'

/** RFC 4180 quoting for a cell that may hold a delimiter, a quote or a line break. */
export function csvCell(v: unknown): string {
  const s = v === null || v === undefined ? '' : String(v)
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s
}

const line = (cells: unknown[]) => cells.map(csvCell).join(',')

/** A safe file name stem for a data set version. */
export function fileStem(d: repo.DataSetRecord): string {
  return `${d.title.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'data-set'}-v${d.version}`
}

export async function pointsCsv(db: Db, user: SessionUser, id: string): Promise<{ name: string; csv: string }> {
  const d = visibleOrNotFound(user, await repo.findDataSet(db, id))
  const rows = (await listPoints(db, id)).map((p) => line([
    p.seq, p.sampleLabel, p.temperatureK.toFixed(3), (p.pressurePa / 1000).toFixed(4), p.x1.toFixed(5), p.x1Uncertainty.toExponential(3),
    p.y1.toFixed(5), p.y1Uncertainty.toExponential(3), p.excluded, p.exclusionReason,
  ]))
  return { name: `${fileStem(d)}-points.csv`, csv: ['seq,sample,t_k,p_kpa,x1,u_x1,y1,u_y1,excluded,exclusion_reason', ...rows].join('\n') + '\n' }
}

const UNITS: Record<string, string> = { A12: '1', A21: '1', a12: 'J/mol', a21: 'J/mol', b12: 'J/mol', b21: 'J/mol', alpha: '1' }

/** Fitted parameters of every fit, with the vapour-pressure sets and the signature, as JSON. */
export async function parametersJson(db: Db, user: SessionUser, id: string) {
  const d = visibleOrNotFound(user, await repo.findDataSet(db, id))
  const inputs = await engineInputs(db, d.systemId)
  const approval = (await listApprovals(db, id)).filter((a) => a.meaning === 'approved').at(-1)
  const fits = await listFits(db, id)
  return {
    name: `${fileStem(d)}-parameters.json`,
    body: {
      format: 'ebullio-parameters/1',
      dataSet: { id: d.id, title: d.title, version: d.version, state: d.state, nominalPressurePa: d.nominalPressurePa },
      system: {
        component1: { name: inputs.system.component1.name, cas: inputs.system.component1.casNumber, liquidMolarVolume: inputs.V1 ?? null },
        component2: { name: inputs.system.component2.name, cas: inputs.system.component2.casNumber, liquidMolarVolume: inputs.V2 ?? null },
      },
      vaporPressure: inputs.vaporPressureSets.map((s) => ({ ...s.parameters, source: s.source })),
      recommendedFitId: d.recommendedFitId,
      fits: fits.map((f) => ({
        id: f.id, model: f.model, recommended: f.id === d.recommendedFitId, activity: f.activity,
        parameters: f.parameters.map((p) => ({ ...p, unit: UNITS[p.name] ?? '1' })),
        statistics: { rmsT: f.statistics.rmsT, rmsY: f.statistics.rmsY, aic: f.statistics.aic, converged: f.statistics.converged },
        points: f.pointIds.length, runAt: f.runAt,
      })),
      approval: approval ? { signedBy: approval.signerName, signedAt: approval.signedAt, reason: approval.reason, digest: approval.digest } : null,
    },
  }
}

export async function parametersCsv(db: Db, user: SessionUser, id: string): Promise<{ name: string; csv: string }> {
  const { name, body } = await parametersJson(db, user, id)
  const rows = body.fits.flatMap((f) => f.parameters.map((p) => line([f.id, f.model, f.recommended, p.name, p.value, p.standardError, p.unit])))
  return { name: name.replace(/\.json$/, '.csv'), csv: ['fit_id,model,recommended,parameter,value,standard_error,unit', ...rows].join('\n') + '\n' }
}
