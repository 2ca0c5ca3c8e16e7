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
  return `${
    d.title
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-|-$/g, '') || 'data-set'
  }-v${d.version}`
}

export async function pointsCsv(db: Db, user: SessionUser, id: string): Promise<{ name: string; csv: string }> {
  const d = visibleOrNotFound(user, await repo.findDataSet(db, id))
  const rows = (await listPoints(db, id)).map((p) =>
    line([
      p.seq,
      p.sampleLabel,
      p.temperatureK.toFixed(3),
      (p.pressurePa / 1000).toFixed(4),
      p.x1.toFixed(5),
      p.x1Uncertainty.toExponential(3),
      p.y1.toFixed(5),
      p.y1Uncertainty.toExponential(3),
      p.excluded,
      p.exclusionReason,
    ]),
  )
  return {
    name: `${fileStem(d)}-points.csv`,
    csv: ['seq,sample,t_k,p_kpa,x1,u_x1,y1,u_y1,excluded,exclusion_reason', ...rows].join('\n') + '\n',
  }
}

/** A vapour-pressure set as exported: its component (1 = lighter, name, CAS), the stored parameters as published, the source. */
export type LabelledVaporPressure = {
  component: { index: 1 | 2; name: string; cas: string | null }
  source: string
} & Record<string, unknown>

const UNITS: Record<string, string> = {
  A12: '1',
  A21: '1',
  a12: 'J/mol',
  a21: 'J/mol',
  b12: 'J/mol',
  b21: 'J/mol',
  alpha: '1',
}

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
        component1: {
          name: inputs.system.component1.name,
          cas: inputs.system.component1.casNumber,
          liquidMolarVolume: inputs.V1 ?? null,
        },
        component2: {
          name: inputs.system.component2.name,
          cas: inputs.system.component2.casNumber,
          liquidMolarVolume: inputs.V2 ?? null,
        },
      },
      vaporPressure: inputs.vaporPressureSets.map((s, i): LabelledVaporPressure => {
        const c = i === 0 ? inputs.system.component1 : inputs.system.component2
        return {
          component: { index: (i + 1) as 1 | 2, name: c.name, cas: c.casNumber },
          ...s.parameters,
          source: s.source,
        }
      }),
      recommendedFitId: d.recommendedFitId,
      fits: fits.map((f) => ({
        id: f.id,
        model: f.model,
        recommended: f.id === d.recommendedFitId,
        activity: f.activity,
        parameters: f.parameters.map((p) => ({ ...p, unit: UNITS[p.name] ?? '1' })),
        statistics: {
          rmsT: f.statistics.rmsT,
          rmsY: f.statistics.rmsY,
          aic: f.statistics.aic,
          converged: f.statistics.converged,
        },
        points: f.pointIds.length,
        runAt: f.runAt,
      })),
      approval: approval
        ? {
            signedBy: approval.signerName,
            signedAt: approval.signedAt,
            reason: approval.reason,
            digest: approval.digest,
          }
        : null,
    },
  }
}

/** Header of the parameters CSV: the first seven columns are the original layout; the component columns were appended so positional readers keep working. */
export const PARAMETERS_CSV_HEADER =
  'fit_id,model,recommended,parameter,value,standard_error,unit,component,component_name,cas'

/**
 * One row per parameter of every fit (component columns empty: a fit belongs to the pair), then one row per
 * entry of each vapour-pressure set (`model` = `vapour-pressure/<kind>`, fit columns empty), labelled with its
 * component (1 or 2), name and CAS number; the set's published source is its last row (`parameter` = `source`).
 */
export async function parametersCsv(db: Db, user: SessionUser, id: string): Promise<{ name: string; csv: string }> {
  const { name, body } = await parametersJson(db, user, id)
  const fitRows = body.fits.flatMap((f) =>
    f.parameters.map((p) => line([f.id, f.model, f.recommended, p.name, p.value, p.standardError, p.unit, '', '', ''])),
  )
  const vpRows = body.vaporPressure.flatMap(({ component: c, kind, source, ...rest }) => {
    const entries: [string, unknown][] = [...Object.entries(rest), ['source', source]]
    return entries.map(([k, v]) =>
      line([
        '',
        `vapour-pressure/${String(kind)}`,
        '',
        k,
        Array.isArray(v) ? v.join(' ') : v,
        '',
        vpUnit(k, kind, rest.temperatureUnit),
        c.index,
        c.name,
        c.cas,
      ]),
    )
  })
  return {
    name: name.replace(/\.json$/, '.csv'),
    csv: [PARAMETERS_CSV_HEADER, ...fitRows, ...vpRows].join('\n') + '\n',
  }
}

/** Unit of a vapour-pressure entry where it has one of its own (Antoine constants take theirs from pressureUnit and temperatureUnit). */
function vpUnit(key: string, kind: unknown, temperatureUnit: unknown): string {
  if (key === 'range') return kind === 'antoine' ? String(temperatureUnit) : 'K'
  return ({ Tref: 'K', Pref: 'Pa', dHvap: 'J/mol' } as Record<string, string>)[key] ?? ''
}
