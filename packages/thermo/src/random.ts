/**
 * Seeded, reproducible noise for generated data: the demo scenario (db/seeds), the engine's reference tests and
 * its benchmarks. Not for anything secret. Imported as `@ebullio/thermo/random`; the engine itself never uses it.
 * The generator is mulberry32 (T. Ettinger, public domain, 2017; from memory), a 32-bit generator with a
 * period of 2³², plenty for a few thousand draws; normal deviates by the Box–Muller transform.
 */

/** A uniform generator on [0, 1) from a 32-bit seed (mulberry32). The same seed gives the same sequence. */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0
  return () => {
    a = (a + 0x6d2b79f5) >>> 0
    let t = a
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

/** One standard normal deviate from a uniform generator (Box–Muller; a draw of exactly 0 is skipped). */
export function gaussian(uniform: () => number): number {
  let u = 0
  while (u === 0) u = uniform()
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * uniform())
}

/** A seeded source of uniform and standard normal deviates, sharing one sequence. */
export function seededRandom(seed: number): { uniform(): number; gaussian(): number } {
  const uniform = mulberry32(seed)
  return { uniform, gaussian: () => gaussian(uniform) }
}
