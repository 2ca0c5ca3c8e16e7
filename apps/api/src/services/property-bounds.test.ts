/**
 * The component-property bounds the forms and the API check (packages/schemas, which does not depend on the engine)
 * must be the engine's own (packages/thermo/src/virial/model.ts), or a component the API accepts would be refused by
 * every Hayden–O'Connell calculation. Checked against the engine's behaviour at and just beyond each bound.
 */
import { engineVaporDimerises, MAX_ASSOCIATION_ETA, MAX_RADIUS_OF_GYRATION } from '@ebullio/schemas'
import { checkVaporModel, MAX_HOC_ETA, usesChemicalTheory, type VaporModel } from '@ebullio/thermo'
import { describe, expect, it } from 'vitest'

// Acetone's critical data (values only need to pass the engine's check).
const component = (RD: number, eta: number) => ({ Tc: 508.1, Pc: 4.7e6, omega: 0.307, Vc: 209, RD, eta })
const hoc = (RD: number, eta: number, eta12?: number): VaporModel =>
  ({
    kind: 'virial',
    correlation: 'hayden-oconnell',
    components: [component(RD, eta), component(2, 0)],
    ...(eta12 === undefined ? {} : { eta12 }),
  }) as VaporModel

/**
 * The engine's range refusal of a vapour, or null when it passes the range checks (checkVaporModel also refuses a
 * molecule whose RD and η give no physical energy parameter; that is another check, not the bound).
 */
function rangeRefusal(v: VaporModel): string | null {
  try {
    checkVaporModel(v)
    return null
  } catch (e) {
    const m = (e as Error).message
    return /from 0 to/.test(m) ? m : null
  }
}

describe("schemas' property bounds agree with the engine's", () => {
  it('association parameter η and solvation η12: the same upper bound', () => {
    expect(MAX_ASSOCIATION_ETA).toBe(MAX_HOC_ETA)
    expect(rangeRefusal(hoc(8, MAX_ASSOCIATION_ETA, MAX_ASSOCIATION_ETA))).toBeNull()
    expect(rangeRefusal(hoc(8, MAX_ASSOCIATION_ETA + 1e-9))).toBe(
      `The association parameter η of component 1 must be a number from 0 to ${MAX_ASSOCIATION_ETA}; got ${MAX_ASSOCIATION_ETA + 1e-9}.`,
    )
    expect(rangeRefusal(hoc(8, 0, MAX_ASSOCIATION_ETA + 1e-9))).toBe(
      `The solvation parameter η12 must be a number from 0 to ${MAX_ASSOCIATION_ETA}; got ${MAX_ASSOCIATION_ETA + 1e-9}.`,
    )
  })
  it('mean radius of gyration RD: the engine accepts the schema bound and refuses beyond it', () => {
    expect(rangeRefusal(hoc(MAX_RADIUS_OF_GYRATION, 0))).toBeNull()
    expect(rangeRefusal(hoc(MAX_RADIUS_OF_GYRATION + 1e-9, 0))).toBe(
      `Hayden–O'Connell needs the mean radius of gyration RD of component 1 (Å, from 0 to ${MAX_RADIUS_OF_GYRATION}); got ${MAX_RADIUS_OF_GYRATION + 1e-9}.`,
    )
  })
  it('the chemical theory: the labels say it ran exactly when the engine runs it (η or η12 at or above 4.5)', () => {
    // engineVaporLabel (schemas) words a fit's vapour; it must not claim, or omit, the engine's treatment
    for (const [eta, eta12] of [
      [4.5, 0],
      [4.4999, 0],
      [0, 4.5],
      [0, 4.4999],
      [10, 10],
      [0, 0],
    ]) {
      const v = hoc(8, eta, eta12)
      expect(engineVaporDimerises(v)).toBe(usesChemicalTheory(v))
    }
    expect(usesChemicalTheory(hoc(8, 4.5))).toBe(true)
    expect(usesChemicalTheory(hoc(8, 4.4999))).toBe(false)
  })
})
