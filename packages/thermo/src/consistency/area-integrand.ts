import { ThermoError } from '../errors.js'
import { buildFitData, type BinaryPoint } from '../fitting/fit-input.js'
import type { VaporPressureModel } from '../types.js'

/** One point of an area test's integrand. */
export interface AreaIntegrandPoint {
  x1: number
  lnGammaRatio: number
}

/**
 * ln(γ1/γ2) = ln(y1·x2/(y2·x1)) + ln(P2sat/P1sat) at each point's own T (the pressure cancels under modified
 * Raoult's law), sorted by x1, and its trapezoidal integrals ∫ln(γ1/γ2)dx1 and ∫|ln(γ1/γ2)|dx1 over the measured
 * compositions (no extrapolation to the pure ends). Pure-end points and excluded points are left out.
 */
export function areaIntegrals(
  allPoints: BinaryPoint[],
  vaporPressure: [VaporPressureModel, VaporPressureModel],
): { integrand: AreaIntegrandPoint[]; area: number; absArea: number; D: number } {
  const points = withoutTwoLayerPoints(allPoints)
  const usable = Array.isArray(points)
    ? points.filter((p) => p && !p.excluded && p.x1 > 0 && p.x1 < 1 && p.y1 > 0 && p.y1 < 1).length
    : 0
  if (usable < 3) throw insufficient(usable)
  const { data } = buildFitData(points, vaporPressure, 'margules', 0)
  const rows = Array.from({ length: data.n }, (_, i) => i).filter((i) => data.y1[i] > 0 && data.y1[i] < 1)
  if (rows.length < 3) throw insufficient(rows.length)
  const { vp1, vp2 } = data
  const integrand = rows
    .map((i) => {
      const T = data.T[i]
      const x = data.x1[i]
      const y = data.y1[i]
      const lnRatio =
        Math.log((y * (1 - x)) / ((1 - y) * x)) + (vp2.a - vp2.b / (T + vp2.c)) - (vp1.a - vp1.b / (T + vp1.c))
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
