/**
 * How large the vapour correction is at a data set's own points (thermo's vaporCorrectionSize), for the lab's
 * workspace, the engineer's version and the members of a system's recommended parameter set. The virial vapour
 * compared is the data set's own when it chose one (its correlation, η12 and Poynting switch); for an ideal-vapour
 * data set Tsonopoulos when both components have its data, else Hayden–O'Connell when both have theirs.
 */
import {
  dataKindOf,
  fitLabel,
  missingVirialData,
  virialCorrelationLabel,
  type VaporModelChoice,
} from '@ebullio/schemas'
import type { SetVapourCorrectionDto, VapourCorrectionDto } from '@ebullio/schemas'
import { vaporCorrectionSize, type ActivityModel, type VaporCorrectionSize, type VaporModel } from '@ebullio/thermo'
import type { Db } from '../db/index.js'
import { AppError } from '../errors/index.js'
import type { DataSetRecord } from '../repositories/datasets.repository.js'
import { findDataSet } from '../repositories/datasets.repository.js'
import { listFits, type FitRecord } from '../repositories/fits.repository.js'
import type { JointFitRecord } from '../repositories/joint-fits.repository.js'
import { listMembers } from '../repositories/joint-fits.repository.js'
import { listPoints, type PointRecord } from '../repositories/points.repository.js'
import { enginePoint } from './point-set.js'
import { binarySystem, engineInputsOf, getSystem } from './systems.service.js'

type SystemRecord = Awaited<ReturnType<typeof getSystem>>

/**
 * The virial vapour to compare an ideal vapour with: the model's own when it is virial; else Tsonopoulos when both
 * components have its data, else Hayden–O'Connell when both have theirs; null when neither can be had.
 */
export function comparedVapour(
  system: Pick<SystemRecord, 'component1' | 'component2'>,
  model: VaporModelChoice,
): Extract<VaporModelChoice, { kind: 'virial' }> | null {
  if (model.kind === 'virial') return model
  const comps = [system.component1, system.component2]
  for (const correlation of ['tsonopoulos', 'hayden-oconnell'] as const)
    if (!missingVirialData(comps, correlation)) return { kind: 'virial', correlation, poynting: false }
  return null
}

/**
 * A point as the comparison judges it: against its own stored uncertainties (u(y₁) from the calibration and
 * replicates, σP of an isothermal point); a boiling temperature has no stored uncertainty, so thermo's default σT
 * (0.1 K) applies. Fits weight points by thermo's defaults instead (enginePoint), which this does not change.
 */
export function correctionPoint(p: PointRecord) {
  return { ...enginePoint(p), ...(p.y1Uncertainty ? { sigmaY: p.y1Uncertainty } : {}) }
}

/** Whether the engine (or the stored inputs) refused: then no figure rather than a broken page. */
const refused = (err: unknown) => (err as { name?: string }).name === 'ThermoError' || err instanceof AppError

const sizeText = (r: VaporCorrectionSize) =>
  r.kind === 'isothermal'
    ? `|ΔP| up to ${((r.maxAbsDP ?? 0) / 1000).toFixed(3)} kPa`
    : `|ΔT| up to ${(r.maxAbsDT ?? 0).toFixed(3)} K`

const figures = (r: VaporCorrectionSize) => ({
  exceedsUncertainty: r.exceedsUncertainty,
  kind: r.kind,
  maxAbsDy: r.maxAbsDy,
  maxAbsDT: r.maxAbsDT ?? null,
  maxAbsDP: r.maxAbsDP ?? null,
})

/**
 * The size of the vapour correction at this data set's included points with its recommended (else newest) fit's
 * activity model, or the ideal solution before any fit; null when it cannot be had (no critical data for either
 * correlation, no vapour-pressure set, no points, or the engine refuses these conditions).
 */
export async function vapourCorrectionOf(
  db: Db,
  d: DataSetRecord,
  pts: PointRecord[],
  read?: { system: SystemRecord; fits: FitRecord[] },
): Promise<VapourCorrectionDto | null> {
  const used = pts.filter((p) => !p.excluded)
  if (used.length === 0) return null
  // the data-set detail passes the system and fits it has already read
  const system = read?.system ?? (await getSystem(db, d.systemId))
  const choice = comparedVapour(system, d.vaporModel)
  if (!choice) return null
  try {
    const inputs = await engineInputsOf(db, system, choice)
    const all = read?.fits ?? (await listFits(db, d.id))
    const fit = all.find((f) => f.id === d.recommendedFitId) ?? all.at(-1)
    const activity = (fit?.activity as unknown as ActivityModel | undefined) ?? { kind: 'ideal' }
    const r = vaporCorrectionSize(binarySystem(inputs, activity), used.map(correctionPoint), {
      kind: dataKindOf(d.layout),
    })
    const ideal = d.vaporModel.kind !== 'virial'
    // the fit named as on every other screen (one shared rule, fit-label.ts)
    const basis = fit ? `the ${fitLabel(fit, all)} fit` : 'an ideal solution (no fit yet)'
    const name = virialCorrelationLabel(r.correlation)
    const size = `${sizeText(r)}, |Δy₁| up to ${r.maxAbsDy.toFixed(4)}, with ${fit ? basis : 'an ideal solution'}`
    return {
      exceeds: ideal && r.exceedsUncertainty,
      vapour: ideal ? 'ideal' : 'virial',
      correlation: r.correlation,
      ...figures(r),
      basis,
      message: !ideal
        ? `The ${name} virial vapour this data set uses moves its bubble points from an ideal vapour's by ${size}: ${r.exceedsUncertainty ? 'more than' : 'within'} their measurement uncertainty.`
        : r.exceedsUncertainty
          ? `A virial vapour (${name} second virial coefficients) would move the bubble points by more than their measurement uncertainty (${size}), but this data set uses an ideal vapour. Consider the virial vapour (Edit details → Vapour model).`
          : null,
    }
  } catch (err) {
    if (refused(err)) return null
    throw err
  }
}

/**
 * The vapour correction at each member's included points, computed with the set's own activity model (and, for a
 * set under a virial vapour, its correlation): `exceeds` when the set uses an ideal vapour and some member's
 * correction exceeds that member's measurement uncertainty. Null when the comparison cannot be had.
 */
export async function setVapourCorrection(db: Db, fit: JointFitRecord): Promise<SetVapourCorrectionDto | null> {
  const stored = fit.options.vapor as VaporModel | undefined
  const ideal = stored?.kind !== 'virial'
  const record = await getSystem(db, fit.systemId)
  const choice = ideal ? comparedVapour(record, { kind: 'ideal' }) : null
  if (ideal && !choice) return null
  try {
    // one read of the vapour-pressure sets; with an ideal set, the vapour it is compared with comes along
    const inputs = await engineInputsOf(db, record, choice ?? undefined)
    // the set's own virial vapour as it was fitted with, else the one an ideal vapour is compared with
    const vapor = stored?.kind === 'virial' ? stored : inputs.vapor
    const system = { ...binarySystem(inputs, fit.activity as unknown as ActivityModel), vapor }
    const members: SetVapourCorrectionDto['members'] = []
    let correlation: SetVapourCorrectionDto['correlation'] = vapor.kind === 'virial' ? vapor.correlation : 'tsonopoulos'
    for (const m of await listMembers(db, fit.id)) {
      const d = (await findDataSet(db, m.dataSetId))!
      const used = (await listPoints(db, d.id)).filter((p) => !p.excluded)
      if (!used.length) continue
      const r = vaporCorrectionSize(system, used.map(correctionPoint), { kind: dataKindOf(d.layout) })
      correlation = r.correlation
      members.push({ dataSetId: d.id, title: d.title, version: d.version, ...figures(r) })
    }
    return {
      exceeds: ideal && members.some((m) => m.exceedsUncertainty),
      vapour: ideal ? 'ideal' : 'virial',
      correlation,
      members,
    }
  } catch (err) {
    if (refused(err)) return null
    throw err
  }
}
