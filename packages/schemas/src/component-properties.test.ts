import { describe, expect, it } from 'vitest'
import { componentPropertiesSchema, virialInputsOf } from './component-properties.js'

describe('component properties', () => {
  // Water: Tc, Pc, ω, Vc as in the Python library `chemicals` 1.5.2; Tsonopoulos a = −0.0109, b = 0
  // (Tsonopoulos & Heidman, Fluid Phase Equilib. 57 (1990) 261).
  const water = {
    Tc: 647.096,
    Pc: 22064000,
    omega: 0.3443,
    Vc: 55.948,
    tsonopoulosA: -0.0109,
    tsonopoulosB: 0,
    source: 'chemicals 1.5.2',
  }
  it('accepts a cited set and gives what a virial vapour needs', () => {
    const p = componentPropertiesSchema.parse(water)
    expect(virialInputsOf(p)).toEqual({
      ok: true,
      Tc: 647.096,
      Pc: 22064000,
      omega: 0.3443,
      Vc: 55.948,
      a: -0.0109,
      b: 0,
    })
  })
  it('names what a virial vapour still lacks', () => {
    const p = componentPropertiesSchema.parse({ Tc: 647.096, source: 'x' })
    expect(virialInputsOf(p)).toEqual({ ok: false, missing: ['Pc', 'omega', 'Vc'] })
    expect(virialInputsOf(null)).toEqual({ ok: false, missing: ['Tc', 'Pc', 'omega', 'Vc'] })
  })
  it('refuses a negative critical temperature and a missing source with the field named', () => {
    const r = componentPropertiesSchema.safeParse({ Tc: -5 })
    expect(r.success).toBe(false)
    const issues = r.error!.issues.map((i) => [i.path.join('.'), i.message])
    expect(issues).toContainEqual(['Tc', 'The critical temperature must be positive (K)'])
    expect(issues.map((i) => i[0])).toContain('source')
  })
  it('refuses fields it does not know', () => {
    expect(componentPropertiesSchema.safeParse({ ...water, Zc: 0.23 }).success).toBe(false)
  })
})
