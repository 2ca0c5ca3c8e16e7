/** Small dense symmetric systems (a handful of parameters), row-major Float64Arrays. */

/**
 * Cholesky factorisation in place of the m×m symmetric matrix `a` (lower triangle used).
 * @returns false when the matrix is not positive definite.
 */
export function cholesky(a: Float64Array, m: number): boolean {
  for (let j = 0; j < m; j++) {
    let d = a[j * m + j]
    for (let k = 0; k < j; k++) d -= a[j * m + k] * a[j * m + k]
    if (!(d > 0)) return false
    const l = Math.sqrt(d)
    a[j * m + j] = l
    for (let i = j + 1; i < m; i++) {
      let s = a[i * m + j]
      for (let k = 0; k < j; k++) s -= a[i * m + k] * a[j * m + k]
      a[i * m + j] = s / l
    }
  }
  return true
}

/** Solve L·Lᵀ·x = b in place of b, with L from {@link cholesky}. */
export function choleskySolve(l: Float64Array, m: number, b: Float64Array): void {
  for (let i = 0; i < m; i++) {
    let s = b[i]
    for (let k = 0; k < i; k++) s -= l[i * m + k] * b[k]
    b[i] = s / l[i * m + i]
  }
  for (let i = m - 1; i >= 0; i--) {
    let s = b[i]
    for (let k = i + 1; k < m; k++) s -= l[k * m + i] * b[k]
    b[i] = s / l[i * m + i]
  }
}

/** Inverse of a symmetric positive-definite m×m matrix, or null when it is singular. */
export function invertSymmetric(a: Float64Array, m: number): Float64Array | null {
  // Scale to unit diagonal first: parameters in J/mol and dimensionless ones differ by 1e6 in JᵀJ.
  const s = new Float64Array(m)
  for (let i = 0; i < m; i++) s[i] = a[i * m + i] > 0 ? 1 / Math.sqrt(a[i * m + i]) : 0
  const l = new Float64Array(m * m)
  for (let i = 0; i < m; i++) for (let j = 0; j < m; j++) l[i * m + j] = a[i * m + j] * s[i] * s[j]
  if (!cholesky(l, m)) return null
  const inv = new Float64Array(m * m)
  const col = new Float64Array(m)
  for (let j = 0; j < m; j++) {
    col.fill(0)
    col[j] = 1
    choleskySolve(l, m, col)
    for (let i = 0; i < m; i++) inv[i * m + j] = col[i] * s[i] * s[j]
  }
  return inv
}

/** JᵀJ (m×m) and Jᵀr (m) of an n×m row-major Jacobian. */
export function normalEquations(
  J: Float64Array,
  r: Float64Array,
  n: number,
  m: number,
  A: Float64Array,
  g: Float64Array,
): void {
  A.fill(0)
  g.fill(0)
  for (let k = 0; k < n; k++) {
    const row = k * m
    const rk = r[k]
    for (let i = 0; i < m; i++) {
      const ji = J[row + i]
      if (ji === 0) continue
      g[i] += ji * rk
      for (let j = 0; j <= i; j++) A[i * m + j] += ji * J[row + j]
    }
  }
  for (let i = 0; i < m; i++) for (let j = 0; j < i; j++) A[j * m + i] = A[i * m + j]
}
