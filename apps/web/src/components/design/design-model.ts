/**
 * The engineer's calculations, done in the browser with @ebullio/thermo on an approved data set's
 * parameters. No mathematics here: only the calls, the shaping for the plots and friendly messages.
 */
import { labelWithNote } from '@ebullio/schemas'
import { csvDocument, fixed } from '@ebullio/schemas/csv-exports'
import {
  bubblePressure,
  bubbleTemperature,
  fenske,
  findAzeotropes,
  mccabeThiele,
  minimumReflux,
  phaseDiagram,
  relativeVolatility,
  type ActivityModel,
  type Azeotrope,
  type BatchFrame,
  type BinarySystem,
  type ThreePhaseLineIsobaric,
  type VaporPressureModel,
} from '@ebullio/thermo'
import type { MeasuredData, ParametersExport } from '../../api/catalogue'
import { isRangeWarning } from './design-limits'
import type { TxyPoint } from '../plots'

/** The Model choice that stands for the system's signed recommended parameter set (not a fit of the version). */
export const SYSTEM_SET_PREFIX = 'system:'

type ExportedFit = ParametersExport['fits'][number]

/**
 * The system's recommended parameter set in the shape of a fit of the version, named as the lab screens name it
 * with the note "recommended for the system"; null when the system has none.
 */
export function systemSetAsFit(p: ParametersExport): ExportedFit | null {
  const r = p.systemRecommendedSet
  if (!r) return null
  return {
    id: SYSTEM_SET_PREFIX + r.id,
    model: r.model,
    label: labelWithNote(r.label, 'recommended for the system'),
    recommended: false,
    activity: r.activity,
    vapor: r.vapor ?? { kind: 'ideal' },
    parameters: r.parameters.map((q) => ({ ...q, standardError: q.standardError ?? 0 })),
    statistics: {},
    points: r.dataSets.reduce((n, d) => n + d.pointCount, 0),
    runAt: String(r.approvedAt ?? ''),
  }
}

/**
 * thermo's BinarySystem from a parameters export and one of its fits (the recommended one by default), or the
 * system's recommended parameter set when `fitId` names it ({@link SYSTEM_SET_PREFIX}).
 */
export function systemFromParameters(
  p: ParametersExport,
  fitId?: string | null,
): { system: BinarySystem; fit: ExportedFit } {
  const systemSet = fitId?.startsWith(SYSTEM_SET_PREFIX) ? systemSetAsFit(p) : null
  const fit =
    systemSet ??
    p.fits.find((f) => f.id === (fitId ?? p.recommendedFitId)) ??
    p.fits.find((f) => f.recommended) ??
    p.fits[0]
  if (!fit) throw new Error('This approved data set has no fitted model to compute with.')
  // the export labels each set with its component; pick by that label (older exports: by position) and hand thermo the model alone
  const byIndex = (i: 1 | 2) => p.vaporPressure.find((v) => v.component?.index === i) ?? p.vaporPressure[i - 1]
  const vp = [byIndex(1), byIndex(2)].map(
    ({ source: _s, component: _c, ...m }) => m as unknown as VaporPressureModel,
  ) as [VaporPressureModel, VaporPressureModel]
  // The fit's own vapour: a virial vapour makes every bubble point, diagram and design calculation γ–φ.
  const vapor = fit.vapor?.kind === 'virial' ? { vapor: fit.vapor as unknown as BinarySystem['vapor'] } : {}
  return {
    system: {
      vaporPressure: vp,
      activity: fit.activity as unknown as ActivityModel,
      names: [p.system.component1.name, p.system.component2.name],
      ...vapor,
    },
    fit,
  }
}

/**
 * The pressure (Pa) the design screens open at for a version: its nominal pressure; for an isothermal set without
 * one, the model's bubble pressure of the equimolar liquid at the set's temperature (rounded to 0.1 kPa), so the
 * constant-pressure diagrams start where the measured mixture boils; 1 atm when neither can be had.
 */
export function designPressureOf(p: ParametersExport, fitId?: string | null): number {
  if (p.dataSet.nominalPressurePa) return p.dataSet.nominalPressurePa
  const T = p.dataSet.nominalTemperatureK
  if (!T) return 101325
  try {
    const P = bubblePressure(systemFromParameters(p, fitId).system, { T, x1: 0.5 }).P
    return Number.isFinite(P) && P > 0 ? Math.round(P / 100) * 100 : 101325
  } catch {
    return 101325
  }
}

/**
 * Bubble and dew lines of every other fit of the version at pressure P (Pa), for comparison on the plots.
 * A fit whose curve cannot be computed at this pressure is left out rather than failing the page.
 */
export function otherFitCurves(
  p: ParametersExport,
  chosenFitId: string | null,
  P: number,
  label: (fit: ParametersExport['fits'][number]) => string = (f) => f.label,
) {
  return p.fits
    .filter((f) => f.id !== chosenFitId)
    .flatMap((f) => {
      try {
        const { system } = systemFromParameters(p, f.id)
        const d = phaseDiagram(system, { P }, { points: 61 })
        return [{ name: label(f), x1: d.x1, y1: d.y1, T: d.kind === 'isobaric' ? d.T : [], hidden: true }]
      } catch {
        return []
      }
    })
}

/** Message of a thermo error (written for a chemist), or a generic one. */
export function errorText(e: unknown): string {
  return e instanceof Error && e.message ? e.message : 'The calculation failed for these inputs.'
}

/**
 * Warnings without repeats: the engine names the temperature in each range warning, so a run that
 * crosses a range limit would list one line per step. The temperature is replaced by "part of this run".
 */
export function tidyWarnings(ws: string[]): string[] {
  const out = ws.map((w) => w.replace(/: -?[\d.]+ K \(-?[\d.]+ °C\) is/, ': part of this calculation is'))
  return [...new Set(out)]
}

/**
 * The warnings a design panel shows itself: the engine's vapour-pressure range warnings are left out because
 * the system screen lists what is extrapolated at this pressure once, in one banner (design-limits.ts).
 */
export function panelWarnings(ws: string[]): string[] {
  return tidyWarnings(ws.filter((w) => !isRangeWarning(w)))
}

/** Everything the diagrams tab shows at one pressure. T in K, P in Pa. */
export interface DiagramsAt {
  P: number
  x1: number[]
  y1: number[]
  T: number[]
  /** Relative volatility α12 at each x1 of the diagram (infinite-dilution values at the ends). */
  alpha: number[]
  /** the first azeotrope (by x1), for the column screen's first targets */
  azeotrope: Azeotrope | null
  /** every azeotrope at P with its kind; a heterogeneous one carries its two liquid layers */
  azeotropes: Azeotrope[]
  azeotropeNote: string | null
  /** where the model's liquid boils as two layers (null: one liquid at every composition) */
  threePhase: ThreePhaseLineIsobaric | null
  /** the two-liquid region below the three-phase line */
  twoLiquids: { T: number[]; x1I: number[]; x1II: number[] } | null
  pure: { T1: number; T2: number }
  /** Bubble points at round liquid compositions 0, 0.1 … 1 for the on-screen table. */
  table: { x1: number; y1: number; T: number; alpha: number }[]
  warnings: string[]
}

function roundTable(system: BinarySystem, P: number): DiagramsAt['table'] {
  return Array.from({ length: 11 }, (_, i) => i / 10).map((x1) => {
    const b = bubbleTemperature(system, { P, x1 })
    const a = relativeVolatility(system, { P, x1 })
    return { x1, y1: b.y1, T: b.T, alpha: a.alpha }
  })
}

/** T–x–y, x–y, α across composition and the azeotrope at pressure P (Pa). */
export function diagramsAt(system: BinarySystem, P: number, points = 101): DiagramsAt {
  const d = phaseDiagram(system, { P }, { points, lle: true })
  if (d.kind !== 'isobaric') throw new Error('Expected an isobaric diagram.')
  let azeotropes: Azeotrope[] = []
  let azeotropeNote: string | null = null
  try {
    azeotropes = findAzeotropes(system, { P })
  } catch (e) {
    azeotropeNote = errorText(e)
  }
  const alpha = d.x1.map((x, i) => {
    if (x <= 0 || x >= 1) return relativeVolatility(system, { P, x1: x }).alpha
    const y = d.y1[i]
    return (y * (1 - x)) / (x * (1 - y))
  })
  const n = d.T.length
  return {
    P,
    x1: d.x1,
    y1: d.y1,
    T: d.T,
    alpha,
    azeotrope: azeotropes[0] ?? null,
    azeotropes,
    azeotropeNote,
    threePhase: d.threePhase ?? null,
    twoLiquids: d.lle ?? null,
    pure: { T1: d.T[n - 1], T2: d.T[0] },
    table: roundTable(system, P),
    warnings: d.warnings,
  }
}

/** The curve table as CSV in Ebullio's layout: one row per liquid composition. */
export function curveTableCsv(d: DiagramsAt, names: [string, string], model: string): string {
  return csvDocument(
    ['x1', 'y1', 't_k', 't_c', 'alpha12'],
    d.x1.map((x, i) => [
      fixed(x, 6),
      fixed(d.y1[i], 6),
      fixed(d.T[i], 3),
      fixed(d.T[i] - 273.15, 3),
      fixed(d.alpha[i], 5),
    ]),
    [
      `Ebullio curve table; ${names[0]} (1) + ${names[1]} (2); model ${model}; P = ${(d.P / 1000).toFixed(4)} kPa`,
      'Preliminary estimate from equilibrium data; not an engineered design.',
    ],
  )
}

/** Inputs of a column estimate: mole fractions of component 1, q liquid fraction of the feed, R as a multiple of Rmin. */
export interface ColumnInputs {
  xF: number
  q: number
  xD: number
  xB: number
  rFactor: number
}

/**
 * Above this ratio of the larger to the smaller end value of α between x_B and x_D the Fenske figure is flagged
 * as unreliable: the equation assumes α roughly constant (common practice, no source; 20 % is our threshold).
 */
export const ALPHA_VARIES_RATIO = 1.2

/**
 * Minimum theoretical stages (reboiler counted) at pressure P (Pa): stepped at total reflux (R = Infinity) on the
 * model's own x–y curve — the figure to use — and, beside it, the Fenske constant-α estimate with the α range
 * between x_B (bottom) and x_D (top) and whether α varies too much for Fenske to be trusted.
 */
export function minimumStages(system: BinarySystem, P: number, c: Omit<ColumnInputs, 'rFactor'>) {
  const source = { system, P }
  const stepped = mccabeThiele(source, { xF: c.xF, q: c.q, xD: c.xD, xB: c.xB, R: Infinity })
  const constantAlpha = fenske(source, { xD: c.xD, xB: c.xB })
  const lo = Math.min(constantAlpha.alphaTop, constantAlpha.alphaBottom)
  const hi = Math.max(constantAlpha.alphaTop, constantAlpha.alphaBottom)
  return {
    Nmin: stepped.fractionalStages,
    wholeStages: stepped.stages,
    fenske: constantAlpha,
    alphaRange: { min: lo, max: hi },
    alphaVaries: hi / lo > ALPHA_VARIES_RATIO,
    warnings: [...stepped.warnings, ...constantAlpha.warnings],
  }
}
export type MinimumStages = ReturnType<typeof minimumStages>

/** Minimum stages (stepped, with Fenske beside), minimum reflux and a McCabe–Thiele stage count on the approved model at pressure P (Pa). */
export function columnEstimate(system: BinarySystem, P: number, c: ColumnInputs) {
  const source = { system, P }
  const minStages = minimumStages(system, P, c)
  const rmin = minimumReflux(source, { xF: c.xF, q: c.q, xD: c.xD })
  const stages = mccabeThiele(source, { xF: c.xF, q: c.q, xD: c.xD, xB: c.xB, R: { timesMinimum: c.rFactor } })
  return { minStages, rmin, stages }
}
export type ColumnEstimate = ReturnType<typeof columnEstimate>

/** A frame of the still with the still-head temperature when there is a column. */
export type StillFrame = BatchFrame & { stillHeadT?: number | null }

/** One cut of distillate: amounts in mol, compositions as mole fractions, temperatures K. */
export interface Cut {
  n: number
  fromFraction: number
  toFraction: number
  moles: number
  x1: number
  potTStart: number | null
  potTEnd: number | null
}

/** Split the run's distillate into `count` equal cuts, from the cumulative distillate composition of each frame. */
export function cutsOf(frames: StillFrame[], charge: number, count: number): Cut[] {
  const last = frames.length - 1
  const cuts: Cut[] = []
  for (let n = 0; n < count; n++) {
    const a = frames[Math.round((n * last) / count)]
    const b = frames[Math.round(((n + 1) * last) / count)]
    const df = b.distilledFraction - a.distilledFraction
    if (df <= 0) continue
    const x1 = (b.cumulativeDistillateX1 * b.distilledFraction - a.cumulativeDistillateX1 * a.distilledFraction) / df
    cuts.push({
      n: n + 1,
      fromFraction: a.distilledFraction,
      toFraction: b.distilledFraction,
      moles: df * charge,
      x1,
      potTStart: a.potT,
      potTEnd: b.potT,
    })
  }
  return cuts
}

/**
 * Measured points for the plots, with the chosen fit's outlier flags. The residual rows are matched to
 * points by `pointId` when present, else by position in the fit's `pointIds`.
 */
export function measuredForPlot(m: MeasuredData, fitId: string | null): TxyPoint[] {
  const fit = m.fits.find((f) => f.id === fitId)
  const flagged = new Set<string>()
  fit?.residuals.forEach((r, i) => {
    const id = typeof r.pointId === 'string' ? r.pointId : fit.pointIds[i]
    if (id && (r.flagged === true || r.outlier === true)) flagged.add(id)
  })
  return m.points.map((p) => ({
    id: p.id,
    T: p.temperatureK,
    x1: p.x1,
    y1: p.y1,
    ux1: p.x1Uncertainty,
    uy1: p.y1Uncertainty,
    excluded: p.excluded,
    outlier: flagged.has(p.id),
    note: p.exclusionReason ? `${p.sampleLabel} (excluded: ${p.exclusionReason})` : p.sampleLabel,
  }))
}
