/**
 * Monotone piecewise-cubic Hermite interpolation (Fritsch–Carlson shape rules, the Fritsch–Butland
 * harmonic-mean slopes), with an exact inverse for increasing data. Used for tabulated equilibrium curves,
 * where an ordinary cubic spline could overshoot and create a false azeotrope.
 */

/** A monotone cubic through (xs[i], ys[i]); xs strictly increasing. */
export interface MonotoneSpline {
  at(x: number): number
  /** Inverse for increasing ys: the x with at(x) = y, clamped to the table. */
  inverse(y: number): number
  xs: number[]
  ys: number[]
}

function edgeSlope(h0: number, h1: number, d0: number, d1: number): number {
  const d = ((2 * h0 + h1) * d0 - h0 * d1) / (h0 + h1)
  if (Math.sign(d) !== Math.sign(d0)) return 0
  if (Math.sign(d0) !== Math.sign(d1) && Math.abs(d) > 3 * Math.abs(d0)) return 3 * d0
  return d
}

function slopes(xs: number[], ys: number[]): number[] {
  const n = xs.length
  const h = xs.slice(1).map((x, i) => x - xs[i])
  const delta = h.map((hi, i) => (ys[i + 1] - ys[i]) / hi)
  if (n === 2) return [delta[0], delta[0]]
  const m = new Array<number>(n)
  for (let i = 1; i < n - 1; i++) {
    if (delta[i - 1] * delta[i] <= 0) m[i] = 0
    else {
      const w1 = 2 * h[i] + h[i - 1]
      const w2 = h[i] + 2 * h[i - 1]
      m[i] = (w1 + w2) / (w1 / delta[i - 1] + w2 / delta[i])
    }
  }
  m[0] = edgeSlope(h[0], h[1], delta[0], delta[1])
  m[n - 1] = edgeSlope(h[n - 2], h[n - 3], delta[n - 2], delta[n - 3])
  return m
}

/** Index i with a[i] ≤ v < a[i+1], clamped to [0, n − 2]. */
function interval(a: number[], v: number): number {
  let lo = 0
  let hi = a.length - 2
  if (v <= a[0]) return 0
  if (v >= a[hi + 1]) return hi
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1
    if (a[mid] <= v) lo = mid
    else hi = mid - 1
  }
  return lo
}

/** Build the interpolant; xs strictly increasing, at least 2 points. */
export function monotoneSpline(xs: number[], ys: number[]): MonotoneSpline {
  const m = slopes(xs, ys)
  const segment = (i: number, x: number) => {
    const h = xs[i + 1] - xs[i]
    const t = (x - xs[i]) / h
    const t2 = t * t
    const t3 = t2 * t
    return (
      (2 * t3 - 3 * t2 + 1) * ys[i] +
      (t3 - 2 * t2 + t) * h * m[i] +
      (-2 * t3 + 3 * t2) * ys[i + 1] +
      (t3 - t2) * h * m[i + 1]
    )
  }
  const segmentSlope = (i: number, x: number) => {
    const h = xs[i + 1] - xs[i]
    const t = (x - xs[i]) / h
    const t2 = t * t
    return (
      ((6 * t2 - 6 * t) * ys[i] + (-6 * t2 + 6 * t) * ys[i + 1]) / h +
      (3 * t2 - 4 * t + 1) * m[i] +
      (3 * t2 - 2 * t) * m[i + 1]
    )
  }
  const at = (x: number) => segment(interval(xs, x), x)
  const inverse = (y: number) => {
    if (y <= ys[0]) return xs[0]
    if (y >= ys[ys.length - 1]) return xs[xs.length - 1]
    const i = interval(ys, y)
    // Newton on a monotone cubic segment, kept inside a shrinking bracket (falls back to bisection)
    let lo = xs[i]
    let hi = xs[i + 1]
    let x = lo + ((y - ys[i]) / (ys[i + 1] - ys[i])) * (hi - lo)
    for (let k = 0; k < 60; k++) {
      const f = segment(i, x) - y
      if (f === 0) return x
      if (f < 0) lo = x
      else hi = x
      const d = segmentSlope(i, x)
      let next = d > 0 ? x - f / d : 0.5 * (lo + hi)
      if (!(next > lo && next < hi)) next = 0.5 * (lo + hi)
      if (Math.abs(next - x) <= 1e-15 * Math.max(1, Math.abs(x))) return next
      x = next
    }
    return x
  }
  return { at, inverse, xs, ys }
}
