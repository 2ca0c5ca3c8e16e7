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
      RD: undefined,
      dipole: 0,
      eta: 0,
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
  it("gives what a Hayden–O'Connell vapour needs (RD, dipole, η; no ω), or names the radius of gyration as missing", () => {
    // HOC parameters of water (RD 0.615 Å, 1.83 D, η 1.7): Hayden & O'Connell (1975) tables, from memory.
    const hoc = componentPropertiesSchema.parse({
      Tc: 647.096,
      Pc: 22064000,
      Vc: 55.948,
      dipole: 1.83,
      radiusOfGyration: 0.615,
      associationEta: 1.7,
      associationSource: 'Hayden & O’Connell 1975, Table 1',
      source: 'chemicals 1.5.2',
    })
    expect(virialInputsOf(hoc, 'hayden-oconnell')).toMatchObject({
      ok: true,
      RD: 0.615,
      dipole: 1.83,
      eta: 1.7,
      omega: 0,
    })
    expect(virialInputsOf(hoc)).toEqual({ ok: false, missing: ['omega'] })
    expect(virialInputsOf(componentPropertiesSchema.parse(water), 'hayden-oconnell')).toEqual({
      ok: false,
      missing: ['radiusOfGyration'],
    })
  })
  it('checks the new numbers with clear messages, and asks for the source of η', () => {
    const issues = (o: object) =>
      componentPropertiesSchema.safeParse({ ...water, ...o }).error?.issues.map((i) => [i.path.join('.'), i.message])
    expect(issues({ radiusOfGyration: -1 })).toEqual([
      ['radiusOfGyration', 'The mean radius of gyration cannot be negative (Å)'],
    ])
    expect(issues({ radiusOfGyration: 25 })).toEqual([
      ['radiusOfGyration', 'The mean radius of gyration must be at most 20 Å'],
    ])
    expect(issues({ radiusOfGyration: '3' })).toEqual([
      ['radiusOfGyration', 'The mean radius of gyration must be a number (Å)'],
    ])
    expect(issues({ associationEta: -0.5, associationSource: 's' })).toEqual([
      ['associationEta', 'The association parameter η cannot be negative (0 means no association)'],
    ])
    expect(issues({ associationEta: 11, associationSource: 's' })).toEqual([
      ['associationEta', 'The association parameter η must be at most 10'],
    ])
    expect(issues({ associationEta: 1.7 })).toEqual([
      ['associationSource', 'Name the source of the association parameter η (paper and table)'],
    ])
    expect(issues({ associationEta: 0 })).toBeUndefined()
    expect(issues({ associationEta: 1, associationSource: 'x'.repeat(501) })).toEqual([
      ['associationSource', 'Keep the source of η under 500 characters'],
    ])
    // markup and formula text in the source stays text, unchanged
    const hostile = '<img src=x onerror=alert(1)> =HYPERLINK("x")'
    expect(
      componentPropertiesSchema.parse({ ...water, associationEta: 1, associationSource: hostile }).associationSource,
    ).toBe(hostile)
  })
  it('refuses fields it does not know', () => {
    expect(componentPropertiesSchema.safeParse({ ...water, Zc: 0.23 }).success).toBe(false)
  })
})
