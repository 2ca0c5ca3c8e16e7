import { describe, expect, it } from 'vitest'
import { gaussian, mulberry32, seededRandom } from './random.js'

describe('seeded noise', () => {
  it('repeats its sequence for a seed and differs between seeds', () => {
    const a = mulberry32(42)
    const b = mulberry32(42)
    const first = Array.from({ length: 5 }, a)
    expect(Array.from({ length: 5 }, b)).toEqual(first)
    expect(Array.from({ length: 5 }, mulberry32(43))).not.toEqual(first)
  })

  it("gives mulberry32's first output for seed 0 (the reference C implementation, from memory)", () => {
    // The C reference returns 32-bit integers; these are they divided by 2^32.
    const r = mulberry32(0)
    expect(Math.round(r() * 4294967296)).toBe(1144304738)
  })

  it('has the moments of its distributions (10 000 draws: uniform mean ½, variance 1/12; normal mean 0, variance 1)', () => {
    const u = mulberry32(7)
    const us = Array.from({ length: 10000 }, u)
    const mean = us.reduce((s, v) => s + v, 0) / us.length
    const variance = us.reduce((s, v) => s + (v - mean) ** 2, 0) / (us.length - 1)
    expect(us.every((v) => v >= 0 && v < 1)).toBe(true)
    expect(mean).toBeCloseTo(0.5, 2)
    expect(variance).toBeCloseTo(1 / 12, 2)
    const g = seededRandom(7)
    const gs = Array.from({ length: 10000 }, () => g.gaussian())
    const gm = gs.reduce((s, v) => s + v, 0) / gs.length
    const gv = gs.reduce((s, v) => s + (v - gm) ** 2, 0) / (gs.length - 1)
    expect(Math.abs(gm)).toBeLessThan(0.04) // 4 standard errors of the mean
    expect(Math.abs(gv - 1)).toBeLessThan(0.06)
  })

  it('skips a uniform draw of exactly 0 instead of returning an infinite deviate', () => {
    const draws = [0, 0.5, 0.125]
    expect(gaussian(() => draws.shift()!)).toBeCloseTo(Math.sqrt(-2 * Math.log(0.5)) * Math.cos(Math.PI / 4), 12)
  })
})
