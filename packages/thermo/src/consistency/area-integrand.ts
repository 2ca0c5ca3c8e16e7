import { ThermoError } from '../errors.js'
import { buildFitData, type BinaryPoint } from '../fitting/fit-input.js'
import type { VaporPressureModel } from '../types.js'
import type { VaporModel } from '../virial/virial-types.js'

/** One point of an area test's integrand. */
export interface AreaIntegrandPoint {
  x1: number
  lnGammaRatio: number
}

/**
 * Refuse a test that needs vapour compositions on data where a point it would use has none (y1 null), naming it.
 * @throws ThermoError 'needs-vapour-composition'.
 */
export function requireVapourCompositions(points: BinaryPoint[], test: string): void {
  if (!Array.isArray(points)) return
  const i = points.findIndex((p) => p && !p.excluded && p.x1 > 0 && p.x1 < 1 && p.y1 === null)
  if (i < 0) return
  throw new ThermoError(
    'needs-vapour-composition',
    `The ${test} needs the vapour composition y1 of every mixture point; point ${i + 1} has none (T–x or P–x data). Exclude such points or fit the data by Barker's method instead.`,
    { point: i + 1 },
  )
}

/**
 * ln(γ1/γ2) = ln(y1·x2/(y2·x1)) + ln(P2sat/P1sat) + ln(Φ1/Φ2) at each point's own T (the pressure cancels; Φ = 1
 * for an ideal vapour, else from the virial vapour at the measured T, P and y), sorted by x1, and its trapezoidal
 * integrals ∫ln(γ1/γ2)dx1 and ∫|ln(γ1/γ2)|dx1 over the measured compositions (no extrapolation to the pure ends).
 * Pure-end points and excluded points are left out.
 * @throws ThermoError 'needs-vapour-composition' when a mixture point has no y.
 */
export function areaIntegrals(
  allPoints: BinaryPoint[],
  vaporPressure: [VaporPressureModel, VaporPressureModel],
  vapor?: VaporModel,
): { integrand: AreaIntegrandPoint[]; area: number; absArea: number; D: number } {
  const points = withoutTwoLayerPoints(allPoints)
  requireVapourCompositions(points, 'area test')
  const usable = Array.isArray(points)
    ? points.filter((p) => p && !p.excluded && p.x1 > 0 && p.x1 < 1 && p.y1 !== null && p.y1 > 0 && p.y1 < 1).length
    : 0
  if (usable < 3) throw insufficient(usable)
  const { data } = buildFitData(points, vaporPressure, 'margules', 0, { vapor })
  const lnPhi = data.lnPhiExp
  const rows = Array.from({ length: data.n }, (_, i) => i).filter((i) => data.y1[i] > 0 && data.y1[i] < 1)
  if (rows.length < 3) throw insufficient(rows.length)
  const { vp1, vp2 } = data
  const integrand = rows
    .map((i) => {
      const T = data.T[i]
      const x = data.x1[i]
      const y = data.y1[i]
      const lnRatio =
        Math.log((y * (1 - x)) / ((1 - y) * x)) +
        (vp2.a - vp2.b / (T + vp2.c)) -
        (vp1.a - vp1.b / (T + vp1.c)) +
        (lnPhi ? lnPhi[0][i] - lnPhi[1][i] : 0)
      return { x1: x, lnGammaRatio: lnRatio }
    })
    .sort((a, b) => a.x1 - b.x1)
  let area = 0
  let absArea = 0
  for (let k = 1; k < integrand.length; k++) {
    const a = integrand[k - 1]
    const b = integrand[k]
    const h = b.x1 - a.x1
    area += 0.5 * h * (a.lnGammaRatio + b.lnGammaRatio)
    absArea += trapezoidAbs(h, a.lnGammaRatio, b.lnGammaRatio)
  }
  return { integrand, area, absArea, D: absArea > 0 ? (100 * Math.abs(area)) / absArea : 0 }
}

/** ∫|f| over one trapezoid whose ends are fa and fb, splitting it where f crosses zero. */
function trapezoidAbs(h: number, fa: number, fb: number): number {
  if (fa * fb >= 0) return 0.5 * h * Math.abs(fa + fb)
  const t = fa / (fa - fb)
  return 0.5 * h * (t * Math.abs(fa) + (1 - t) * Math.abs(fb))
}

function insufficient(n: number): ThermoError {
  return new ThermoError(
    'insufficient-data',
    `The area test needs at least 3 mixture points with 0 < x1 < 1 and 0 < y1 < 1; got ${n}.`,
  )
}

/**
 * Two-layer (heterogeneous) points left out of a consistency test: their overall liquid composition is not the
 * composition of one liquid, so ln γ computed from it means nothing. They are treated as excluded.
 */
export function withoutTwoLayerPoints(points: BinaryPoint[]): BinaryPoint[] {
  if (!Array.isArray(points) || !points.some((p) => p?.heterogeneous)) return points
  return points.map((p) => (p?.heterogeneous ? { ...p, excluded: true } : p))
}

/** The warning a consistency test gives when it left two-layer points out. */
export function twoLayerWarnings(points: BinaryPoint[]): string[] {
  const n = Array.isArray(points) ? points.filter((p) => p?.heterogeneous && !p.excluded).length : 0
  if (n === 0) return []
  return [
    `${n} two-layer point${n > 1 ? 's were' : ' was'} left out: the test needs the composition of one liquid, and a two-layer sample has two.`,
  ]
}
