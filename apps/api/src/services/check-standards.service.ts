/**
 * GC check standards over time: each standard of known composition, read with its run's calibration, gives a
 * deviation x1 measured − x1 known. One control chart per GC method (thermo's `controlChart`: centre line and
 * ±2σ/±3σ limits from the first results, Western Electric run rules named in plain words).
 */
import { CONTROL_RULE_TEXT, controlChart, type ControlChartResult } from '@ebullio/thermo'
import type { Db } from '../db/index.js'
import { notFound } from '../errors/index.js'
import { findGcMethod } from '../repositories/calibrations.repository.js'
import { listCheckStandards } from '../repositories/check-standards.repository.js'
import { thermo } from './lab-access.js'

/** Said instead of a chart when there are too few results to set a centre line and σ. */
export const TOO_FEW_CHECKS = 'At least two check-standard results are needed before limits can be drawn.'

/** The method's check standards in time order, each with its deviation and the run rules it broke. */
export async function gcMethodCheckStandards(db: Db, gcMethodId: string, o: { baseline: number }) {
  const method = await findGcMethod(db, gcMethodId)
  if (!method) throw notFound('There is no such GC method.')
  const rows = await listCheckStandards(db, gcMethodId)
  const deviations = rows.map((r) => r.measuredX1 - r.knownX1)
  const chart: ControlChartResult | null =
    rows.length >= 2
      ? thermo('Control chart', () => controlChart({ values: deviations, baselineCount: o.baseline }))
      : null
  return {
    gcMethodId,
    gcMethodName: method.name,
    unit: 'mole fraction',
    quantity: 'x1 measured − x1 known',
    items: rows.map((r, i) => ({
      ...r,
      deviation: deviations[i],
      rules: chart ? chart.flags[i].map((f) => CONTROL_RULE_TEXT[f]) : [],
      outOfControl: chart ? chart.flags[i].length > 0 : false,
    })),
    chart: chart && {
      centre: chart.centre,
      sigma: chart.sigma,
      baselineCount: chart.baselineCount,
      limits: chart.limits,
      outOfControl: chart.outOfControl.map((i) => rows[i].id),
    },
    note: chart ? null : TOO_FEW_CHECKS,
  }
}
