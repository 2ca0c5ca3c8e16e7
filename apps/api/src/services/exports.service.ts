/** Exports in Ebullio's own documented layouts (docs/csv-formats.md): points CSV, parameters JSON and CSV. */
import type { SessionUser } from '../auth/index.js'
import type { Db } from '../db/index.js'
import { listApprovals } from '../repositories/approvals.repository.js'
import * as repo from '../repositories/datasets.repository.js'
import { listFits } from '../repositories/fits.repository.js'
import { findJointFit } from '../repositories/joint-fits.repository.js'
import { listPoints } from '../repositories/points.repository.js'
import { visibleOrNotFound } from './lab-access.js'
import { recommendedSetOf } from './joint-fit-signing.js'
import { engineInputs } from './systems.service.js'
import { setVapourCorrection } from './vapour-correction.js'
import {
  csvDocument,
  dataSetFileName,
  pointsCsv as writePointsCsv,
  slugify,
  type CsvCell,
} from '@ebullio/schemas/csv-exports'
import { dataKindOf, fitLabel, memberConditionText, vaporModelLabel } from '@ebullio/schemas'
import type { VaporModel } from '@ebullio/thermo'

/** The file-name stem of a data set version's files (`éthanol-water-v2`): the shared slug, which keeps every letter. */
export function fileStem(d: { title: string; version: number }): string {
  return `${slugify(d.title, 'data-set')}-v${d.version}`
}

export async function pointsCsv(db: Db, user: SessionUser, id: string): Promise<{ name: string; csv: string }> {
  const d = visibleOrNotFound(user, await repo.findDataSet(db, id))
  return { name: dataSetFileName(d, 'points', 'csv'), csv: writePointsCsv(await listPoints(db, id)) }
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
  V1: 'cm3/mol',
  V2: 'cm3/mol',
  a12T: 'J/(mol K)',
  a21T: 'J/(mol K)',
  b12T: 'J/(mol K)',
  b21T: 'J/(mol K)',
}

/** The temperature dependence of a joint parameter set's energies (thermo's T_REF = 298.15 K). */
export const TEMPERATURE_FORM: Record<string, string> = {
  wilson: 'a12(T) = a12 + a12T (T - 298.15 K); a21(T) = a21 + a21T (T - 298.15 K)',
  nrtl: 'b12(T) = b12 + b12T (T - 298.15 K); b21(T) = b21 + b21T (T - 298.15 K)',
  uniquac: 'a12(T) = a12 + a12T (T - 298.15 K); a21(T) = a21 + a21T (T - 298.15 K); tau_ij = exp(-a_ij(T)/(R T))',
}

/** The system's signed recommended parameter set as exported with every data set's parameters (null: none). */
async function systemRecommendedSet(db: Db, systemId: string) {
  const r = await recommendedSetOf(db, systemId)
  if (!r) return null
  const fit = await findJointFit(db, r.id)
  return {
    ...r,
    // the engineer's page warns with it when the set uses an ideal vapour (useSystemDesign.ts)
    vapourCorrection: fit ? await setVapourCorrection(db, fit) : null,
    equation: MODEL_EQUATIONS[r.model] ?? r.model,
    temperatureForm: TEMPERATURE_FORM[r.model] ?? null,
    parameters: r.parameters.map((p) => ({ ...p, unit: UNITS[p.name] ?? '1' })),
    held: heldSettings(r),
  }
}

/** How the curve is computed from the parameters (the engine's conventions, packages/thermo/src/activity/kernel.ts). */
export const VLE_RELATION =
  "modified Raoult's law, ideal vapour: y_i P = x_i gamma_i P_i_sat(T); bubble points solved for T at the measured P"
/** The same under a virial vapour (packages/thermo/src/virial). */
export const VLE_RELATION_VIRIAL =
  'gamma-phi: y_i Phi_i P = x_i gamma_i P_i_sat(T), Phi_i = phi_i / (phi_i_sat PF_i) from the virial equation truncated after B (Tsonopoulos second virial coefficients); bubble points solved for T at the measured P'
/** The same under a Hayden–O'Connell virial vapour. */
export const VLE_RELATION_VIRIAL_HOC = VLE_RELATION_VIRIAL.replace(
  'Tsonopoulos second virial coefficients',
  "Hayden-O'Connell second virial coefficients, total B including the association terms; with a carboxylic acid (eta >= 4.5) the chemical theory of dimerisation instead: monomer-dimer equilibria with K_ij = -B_ij^D (2 - delta_ij)/RT, phi_i = z_iM phi_iM / y_i",
)

/** The relation a data set's fits use, worded for its kind of data and vapour model. */
function vleRelationOf(d: repo.DataSetRecord): string {
  const base =
    d.vaporModel.kind !== 'virial'
      ? VLE_RELATION
      : d.vaporModel.correlation === 'hayden-oconnell'
        ? VLE_RELATION_VIRIAL_HOC
        : VLE_RELATION_VIRIAL
  return dataKindOf(d.layout) === 'isothermal'
    ? base.replace('solved for T at the measured P', 'solved for P at the measured T')
    : base
}

/** Each model's equations in the engine's parameter names (Smith, Van Ness & Abbott, 7th ed., §12.1–12.2). */
export const MODEL_EQUATIONS: Record<string, string> = {
  margules:
    'two-parameter Margules: ln gamma1 = x2^2 [A12 + 2 (A21 - A12) x1]; ln gamma2 = x1^2 [A21 + 2 (A12 - A21) x2]',
  'van-laar':
    'Van Laar: ln gamma1 = A12 (A21 x2 / (A12 x1 + A21 x2))^2; ln gamma2 = A21 (A12 x1 / (A12 x1 + A21 x2))^2',
  wilson:
    'Wilson: Lambda12 = (V2/V1) exp(-a12/(R T)); Lambda21 = (V1/V2) exp(-a21/(R T)); ' +
    'ln gamma1 = -ln(x1 + x2 Lambda12) + x2 [Lambda12/(x1 + x2 Lambda12) - Lambda21/(x2 + x1 Lambda21)]',
  uniquac:
    'UNIQUAC (z = 10): tau12 = exp(-a12/(R T)); tau21 = exp(-a21/(R T)); theta_i = q_i x_i / sum(q x); Phi_i = r_i x_i / sum(r x); ' +
    'l_i = 5 (r_i - q_i) - (r_i - 1); ln gamma1 = ln(Phi1/x1) + 5 q1 ln(theta1/Phi1) + l1 - (Phi1/x1) sum(x l) ' +
    '+ q1 [1 - ln(theta1 + theta2 tau21) - theta1/(theta1 + theta2 tau21) - theta2 tau12/(theta1 tau12 + theta2)]',
  nrtl:
    'NRTL: tau12 = b12/(R T); tau21 = b21/(R T); G12 = exp(-alpha tau12); G21 = exp(-alpha tau21); ' +
    'ln gamma1 = x2^2 [tau21 (G21/(x1 + x2 G21))^2 + tau12 G12/(x2 + x1 G12)^2]',
}

/** What the fit used but did not fit: NRTL's α when held, Wilson's V1 and V2 (cm³/mol), UNIQUAC's r and q, with their units. */
function heldSettings(f: { activity: Record<string, unknown>; parameters: { name: string }[] }) {
  const fitted = new Set(f.parameters.map((p) => p.name))
  return Object.entries(f.activity)
    .filter(([k, v]) => k !== 'kind' && !fitted.has(k) && typeof v === 'number')
    .map(([name, value]) => ({ name, value: value as number, unit: UNITS[name] ?? '1' }))
}

/** Fitted parameters of every fit, with the vapour-pressure sets and the signature, as JSON. */
export async function parametersJson(db: Db, user: SessionUser, id: string) {
  const d = visibleOrNotFound(user, await repo.findDataSet(db, id))
  const inputs = await engineInputs(db, d.systemId)
  const approval = (await listApprovals(db, id)).filter((a) => a.meaning === 'approved').at(-1)
  const fits = await listFits(db, id)
  return {
    name: dataSetFileName(d, 'parameters', 'json'),
    body: {
      format: 'ebullio-parameters/1',
      dataSet: {
        id: d.id,
        title: d.title,
        version: d.version,
        state: d.state,
        nominalPressurePa: d.nominalPressurePa,
        // kind of data: layout txy/tx isobaric, pxy/px isothermal (with its temperature, K)
        layout: d.layout,
        kind: dataKindOf(d.layout),
        nominalTemperatureK: d.nominalTemperatureK,
        vaporModel: d.vaporModel,
        // where the numbers come from: 'gc', 'other-method' (with the method) or 'literature' (with its citation)
        origin: d.origin,
        originMethod: d.originMethod,
        citation: d.citation,
        countsAsOwn: d.countsAsOwn,
      },
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
      vleRelation: vleRelationOf(d),
      fits: fits.map((f) => ({
        id: f.id,
        model: f.model,
        // the name the lab screens give this fit (packages/schemas/src/fit-label.ts)
        label: fitLabel(f, fits),
        recommended: f.id === d.recommendedFitId,
        equation: MODEL_EQUATIONS[f.model] ?? f.model,
        objective: f.options.objective ?? null,
        // the vapour the fit was computed with (a virial vapour with the critical data it used)
        vapor: (f.options.vapor as Record<string, unknown> | undefined) ?? { kind: 'ideal' },
        activity: f.activity,
        parameters: f.parameters.map((p) => ({ ...p, unit: UNITS[p.name] ?? '1' })),
        held: heldSettings(f),
        pointSetDigest: (f as { pointSetDigest?: string | null }).pointSetDigest ?? null,
        statistics: {
          rmsT: f.statistics.rmsT,
          rmsP: f.statistics.rmsP ?? null,
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
      systemRecommendedSet: await systemRecommendedSet(db, d.systemId),
    },
  }
}

/** Header of the parameters CSV: the first seven columns are the original layout; the component columns were appended so positional readers keep working. */
export const PARAMETERS_CSV_HEADER =
  'fit_id,model,recommended,parameter,value,standard_error,unit,component,component_name,cas'

/**
 * The parameters file, everything needed to recompute the curve and matching the JSON export: per fit its equation,
 * objective, fitted parameters with standard errors, held settings (NRTL α when held, Wilson V1 and V2), statistics
 * and point-set digest; then each vapour-pressure set labelled with its component and source; then the data set,
 * the VLE relation and the approval. Layout: docs/csv-formats.md.
 */
export async function parametersCsv(db: Db, user: SessionUser, id: string): Promise<{ name: string; csv: string }> {
  const { body } = await parametersJson(db, user, id)
  const d = visibleOrNotFound(user, await repo.findDataSet(db, id))
  const fitRow = (f: (typeof body.fits)[number], name: string, value: CsvCell, se: CsvCell = null, unit = '') =>
    [f.id, f.model, f.recommended, name, value, se, unit, null, null, null] as CsvCell[]
  const fitRows = body.fits.flatMap((f) => [
    fitRow(f, 'label', f.label),
    fitRow(f, 'equation', f.equation),
    fitRow(f, 'objective', f.objective as CsvCell),
    fitRow(f, 'vapour_model', vapourLine(f.vapor)),
    ...f.parameters.map((p) => fitRow(f, p.name, p.value, p.standardError, p.unit)),
    ...f.held.map((h) => fitRow(f, h.name, h.value, null, h.unit)),
    ...(f.model === 'nrtl'
      ? [
          fitRow(
            f,
            'alpha_fitted',
            f.parameters.some((p) => p.name === 'alpha'),
          ),
        ]
      : []),
    fitRow(f, 'rms_T', f.statistics.rmsT as CsvCell, null, 'K'),
    ...(f.statistics.rmsP !== null ? [fitRow(f, 'rms_P', f.statistics.rmsP as CsvCell, null, 'Pa')] : []),
    fitRow(f, 'rms_y', f.statistics.rmsY as CsvCell, null, '1'),
    fitRow(f, 'aic', f.statistics.aic as CsvCell),
    fitRow(f, 'converged', f.statistics.converged as CsvCell),
    fitRow(f, 'points', f.points),
    fitRow(f, 'point_set_digest', f.pointSetDigest),
    fitRow(f, 'run_at', f.runAt.toISOString()),
  ])
  const vpRows = body.vaporPressure.flatMap(({ component: c, kind, source, ...rest }) => {
    const entries: [string, unknown][] = [...Object.entries(rest), ['source', source]]
    return entries.map(([k, v]): CsvCell[] => [
      null,
      `vapour-pressure/${String(kind)}`,
      null,
      k,
      (Array.isArray(v) ? v.join(' ') : v) as CsvCell,
      null,
      vpUnit(k, kind, rest.temperatureUnit),
      c.index,
      c.name,
      c.cas,
    ])
  })
  const a = body.approval
  const recordRows: [string, string, CsvCell, string][] = [
    ['data-set', 'title', body.dataSet.title, ''],
    ['data-set', 'version', body.dataSet.version, ''],
    ['data-set', 'state', body.dataSet.state, ''],
    ['data-set', 'nominal_pressure', body.dataSet.nominalPressurePa, 'Pa'],
    ['data-set', 'kind', body.dataSet.kind, ''],
    ['data-set', 'nominal_temperature', body.dataSet.nominalTemperatureK, 'K'],
    ['data-set', 'vapour_model', vapourLine(body.dataSet.vaporModel), ''],
    ['data-set', 'origin', body.dataSet.origin, ''],
    ['data-set', 'origin_method', body.dataSet.originMethod, ''],
    ['data-set', 'citation', citationLine(body.dataSet.citation), ''],
    ['data-set', 'counts_as_own_measurement', body.dataSet.countsAsOwn, ''],
    ['data-set', 'recommended_fit_id', body.recommendedFitId, ''],
    ['data-set', 'vle_relation', body.vleRelation, ''],
    ['approval', 'signed_by', a?.signedBy ?? null, ''],
    ['approval', 'signed_at', a ? new Date(a.signedAt).toISOString() : null, ''],
    ['approval', 'reason', a?.reason ?? null, ''],
    ['approval', 'signature_digest', a?.digest ?? null, 'SHA-256'],
  ]
  const rs = body.systemRecommendedSet
  const setRow = (name: string, value: CsvCell, se: CsvCell = null, unit = ''): CsvCell[] => [
    rs!.id,
    `system-recommended/${rs!.model}`,
    'system',
    name,
    value,
    se,
    unit,
    null,
    null,
    null,
  ]
  const setRows = rs
    ? [
        setRow('label', rs.label),
        setRow('equation', rs.equation),
        setRow('temperature_form', rs.temperatureForm),
        ...rs.parameters.map((p) => setRow(p.name, p.value, p.standardError, p.unit)),
        ...rs.held.map((h) => setRow(h.name, h.value, null, h.unit)),
        setRow('temperature_min', rs.range.Tmin, null, 'K'),
        setRow('temperature_max', rs.range.Tmax, null, 'K'),
        setRow('pressure_min', rs.range.Pmin, null, 'Pa'),
        setRow('pressure_max', rs.range.Pmax, null, 'Pa'),
        setRow('vapour_model', vaporModelLabel(rs.vaporModel)),
        setRow('data_sets', rs.dataSets.map((d) => `${d.title} v${d.version} (${memberConditionText(d)})`).join('; ')),
        setRow('signed_by', rs.signedBy),
        setRow('signed_at', rs.approvedAt ? new Date(rs.approvedAt).toISOString() : null),
        setRow('signature_digest', rs.digest, null, 'SHA-256'),
      ]
    : []
  const tail = recordRows.map(([model, name, value, unit]): CsvCell[] => [
    null,
    model,
    null,
    name,
    value,
    null,
    unit,
    null,
    null,
    null,
  ])
  return {
    name: dataSetFileName(d, 'parameters', 'csv'),
    csv: csvDocument(PARAMETERS_CSV_HEADER.split(','), [...fitRows, ...setRows, ...vpRows, ...tail]),
  }
}

/** Unit of a vapour-pressure entry where it has one of its own (Antoine constants take theirs from pressureUnit and temperatureUnit). */
function vpUnit(key: string, kind: unknown, temperatureUnit: unknown): string {
  if (key === 'range') return kind === 'antoine' ? String(temperatureUnit) : 'K'
  return ({ Tref: 'K', Pref: 'Pa', dHvap: 'J/mol' } as Record<string, string>)[key] ?? ''
}

/** A literature citation on one line: authors (year). title. source volume, pages. doi. table. */
function citationLine(c: repo.DataSetRecord['citation']): string | null {
  if (!c) return null
  const vol = [c.volume, c.pages].filter(Boolean).join(', ')
  return [`${c.authors} (${c.year}). ${c.title}. ${c.source}${vol ? ' ' + vol : ''}.`, c.doi && `doi:${c.doi}`, c.table]
    .filter(Boolean)
    .join(' ')
}

/** "ideal" or "virial tsonopoulos; poynting=false; Tc1=…; …" — every number a virial vapour used, in one cell. */
function vapourLine(v: Record<string, unknown> | { kind: string }): string {
  // the vapour as thermo stored it with the fit (its own type; stored JSON, so read defensively below)
  const o = v as VaporModel
  if (o.kind !== 'virial') return 'ideal'
  const hoc = o.correlation === 'hayden-oconnell'
  const parts = [`virial ${o.correlation ?? 'tsonopoulos'}`, `poynting=${o.poynting ? 'true' : 'false'}`]
  o.components?.forEach((c, i) =>
    parts.push(
      `Tc${i + 1}=${c.Tc} K`,
      `Pc${i + 1}=${c.Pc} Pa`,
      ...(hoc
        ? [
            `Vc${i + 1}=${c.Vc} cm3/mol`,
            `RD${i + 1}=${c.RD} A`,
            `mu${i + 1}=${c.dipole ?? 0} D`,
            `eta${i + 1}=${c.eta ?? 0}`,
          ]
        : [
            `omega${i + 1}=${c.omega}`,
            `Vc${i + 1}=${c.Vc} cm3/mol`,
            `a${i + 1}=${c.tsonopoulos?.a ?? 0}`,
            `b${i + 1}=${c.tsonopoulos?.b ?? 0}`,
          ]),
    ),
  )
  if (hoc) parts.push(`eta12=${o.eta12 ?? 0}`)
  return parts.join('; ')
}
