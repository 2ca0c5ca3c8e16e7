import { describe, expect, it } from 'vitest'
import {
  engineVaporLabel,
  missingVirialData,
  vaporModelChoiceSchema,
  vaporModelLabel,
  vaporChoiceOfEngine,
} from './data-kind.js'

const issues = (o: unknown) =>
  vaporModelChoiceSchema.safeParse(o).error?.issues.map((i) => [i.path.join('.'), i.message])

describe('the vapour model a data set chooses', () => {
  it("takes Hayden–O'Connell with the unlike pair's η12 and its source, and names it in words", () => {
    const v = vaporModelChoiceSchema.parse({
      kind: 'virial',
      correlation: 'hayden-oconnell',
      eta12: 1.55,
      eta12Source: 'Hayden & O’Connell 1975, Table 2',
    })
    expect(v).toEqual({
      kind: 'virial',
      correlation: 'hayden-oconnell',
      poynting: false,
      eta12: 1.55,
      eta12Source: 'Hayden & O’Connell 1975, Table 2',
    })
    expect(vaporModelLabel(v)).toBe('virial gas, Hayden–O’Connell second virial coefficients (η12 = 1.55)')
    expect(vaporModelLabel({ kind: 'virial', correlation: 'tsonopoulos', poynting: true })).toBe(
      'virial gas, Tsonopoulos second virial coefficients, with the Poynting factor',
    )
    // an old record without a correlation is Tsonopoulos
    expect(vaporModelChoiceSchema.parse({ kind: 'virial' })).toEqual({
      kind: 'virial',
      correlation: 'tsonopoulos',
      poynting: false,
    })
  })

  it('refuses what does not belong, naming the field', () => {
    expect(issues({ kind: 'virial', correlation: 'pitzer' })).toEqual([
      ['correlation', "The virial correlation must be 'tsonopoulos' or 'hayden-oconnell'"],
    ])
    expect(issues({ kind: 'virial', eta12: 1 })).toEqual([
      ['eta12', "The solvation parameter η12 belongs to Hayden–O'Connell; Tsonopoulos does not use it"],
    ])
    expect(issues({ kind: 'virial', correlation: 'hayden-oconnell', eta12: 1.2 })).toEqual([
      ['eta12Source', 'Name the source of the solvation parameter η12 (paper and table)'],
    ])
    expect(issues({ kind: 'virial', correlation: 'hayden-oconnell', eta12: -1, eta12Source: 's' })).toEqual([
      ['eta12', 'The solvation parameter η12 cannot be negative (0 means no solvation)'],
    ])
    expect(issues({ kind: 'virial', correlation: 'hayden-oconnell', eta12: 12, eta12Source: 's' })).toEqual([
      ['eta12', 'The solvation parameter η12 must be at most 10'],
    ])
    expect(issues({ kind: 'virial', correlation: 'hayden-oconnell', eta12: '1' })).toEqual([
      ['eta12', 'The solvation parameter η12 must be a number'],
    ])
    expect(issues({ kind: 'virial', correlation: 'hayden-oconnell', eta12: 1, eta12Source: 'y'.repeat(501) })).toEqual([
      ['eta12Source', 'Keep the source of η12 under 500 characters'],
    ])
  })

  it("names the radius of gyration a Hayden–O'Connell vapour still lacks, per component", () => {
    const props = { Tc: 508.1, Pc: 4692400, omega: 0.3071, Vc: 212.766, source: 's' }
    expect(
      missingVirialData(
        [
          { name: 'acetone', properties: props },
          { name: 'methanol', properties: { ...props, radiusOfGyration: 1.552 } },
        ],
        'hayden-oconnell',
      ),
    ).toBe(
      "A Hayden–O'Connell virial vapour needs each component's critical data and mean radius of gyration; missing — acetone: mean radius of gyration RD. Enter them on the components screen (with their source) or choose the ideal vapour.",
    )
    expect(missingVirialData([{ name: 'acetone', properties: props }])).toBeNull()
  })
})

describe('vaporChoiceOfEngine', () => {
  it('reads back the choice behind a stored engine vapour, and words it as every result states it', () => {
    const components = [{ Tc: 1, Pc: 1, omega: 0, Vc: 1 }]
    expect(vaporChoiceOfEngine(undefined)).toEqual({ kind: 'ideal' })
    expect(vaporChoiceOfEngine({ kind: 'ideal' })).toEqual({ kind: 'ideal' })
    const tso = vaporChoiceOfEngine({ kind: 'virial', correlation: 'tsonopoulos', poynting: true, components })
    expect(tso).toEqual({ kind: 'virial', correlation: 'tsonopoulos', poynting: true })
    expect(vaporModelLabel(tso)).toBe('virial gas, Tsonopoulos second virial coefficients, with the Poynting factor')
    const hoc = vaporChoiceOfEngine({ kind: 'virial', correlation: 'hayden-oconnell', eta12: 1.3, components })
    expect(hoc).toEqual({ kind: 'virial', correlation: 'hayden-oconnell', poynting: false, eta12: 1.3 })
    expect(vaporModelLabel(hoc)).toBe('virial gas, Hayden–O’Connell second virial coefficients (η12 = 1.3)')
  })
  it('engineVaporLabel words a stored engine vapour in one step', () => {
    const components = [{ Tc: 1, Pc: 1, omega: 0, Vc: 1 }]
    expect(engineVaporLabel(undefined)).toBe('ideal gas (modified Raoult’s law)')
    expect(engineVaporLabel({ kind: 'virial', correlation: 'hayden-oconnell', eta12: 1.3, components })).toBe(
      'virial gas, Hayden–O’Connell second virial coefficients (η12 = 1.3)',
    )
  })
  it('engineVaporLabel says when the chemical theory of dimerisation runs (HOC, an η or η12 ≥ 4.5), and only then', () => {
    const water = { Tc: 647.096, Pc: 22064000, omega: 0.3443, Vc: 55.948, RD: 0.615, eta: 1.7 }
    const acid = { Tc: 591.95, Pc: 5.786e6, omega: 0.467, Vc: 177.6, RD: 2.595, eta: 4.5 }
    const hoc = { kind: 'virial', correlation: 'hayden-oconnell' }
    const chem =
      'virial gas, Hayden–O’Connell second virial coefficients; carboxylic acid (η ≥ 4.5): fugacity coefficients by the chemical theory of dimerisation'
    expect(engineVaporLabel({ ...hoc, components: [acid, water] })).toBe(chem)
    expect(engineVaporLabel({ ...hoc, components: [water, acid], poynting: true })).toBe(
      chem.replace('coefficients;', 'coefficients, with the Poynting factor;'),
    )
    expect(engineVaporLabel({ ...hoc, eta12: 4.5, components: [water, water] })).toBe(
      chem.replace('coefficients;', 'coefficients (η12 = 4.5);'),
    )
    // just below the branch, and Tsonopoulos (which has no η), say nothing of it
    expect(engineVaporLabel({ ...hoc, components: [{ ...acid, eta: 4.4999 }, water] })).toBe(
      'virial gas, Hayden–O’Connell second virial coefficients',
    )
    expect(engineVaporLabel({ kind: 'virial', correlation: 'tsonopoulos', components: [acid, water] })).toBe(
      'virial gas, Tsonopoulos second virial coefficients',
    )
  })
})
