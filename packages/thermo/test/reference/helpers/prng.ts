/** Deterministic noise for generated data sets: mulberry32 (public-domain 32-bit generator) and Box–Muller. */
export function prng(seed: number): { uniform(): number; gaussian(): number } {
  let s = seed >>> 0
  const uniform = (): number => {
    s = (s + 0x6d2b79f5) >>> 0
    let t = s
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
  const gaussian = (): number => {
    let u = 0
    while (u === 0) u = uniform()
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * uniform())
  }
  return { uniform, gaussian }
}

/** |actual − expected| ≤ tol, with a message that shows all three. */
export function near(actual: number, expected: number, tol: number): { pass: boolean; text: string } {
  return { pass: Math.abs(actual - expected) <= tol, text: `${actual} vs ${expected} ± ${tol}` }
}
