import type { BinarySystem } from '@ebullio/thermo'
import { describe, expect, it } from 'vitest'
import { batchFailureText, batchRun, defaultStopValue, stopNote, untilOf, type BatchInputs } from './batch-stops'

// Antoine constants, ln(P/kPa) = A − B/(t/°C + C): Smith, Van Ness & Abbott, 7th ed., Table B.2
// (benzene read in print; toluene from memory, it reproduces the table's normal boiling point). Ideal liquid.
const benzeneToluene: BinarySystem = {
  vaporPressure: [
    { kind: 'antoine', A: 13.7819, B: 2726.81, C: 217.572, log: 'ln', pressureUnit: 'kPa', temperatureUnit: 'C' },
    { kind: 'antoine', A: 13.932, B: 3056.96, C: 217.625, log: 'ln', pressureUnit: 'kPa', temperatureUnit: 'C' },
  ],
  activity: { kind: 'ideal' },
}
const names: [string, string] = ['benzene', 'toluene']
const P = 101325
const still = (o: Partial<BatchInputs>): BatchInputs => ({
  moles: 100,
  x1: 0.4,
  stagesAbovePot: 0,
  R: 2,
  stopBy: 'distilledFraction',
  stopValue: 0.5,
  ...o,
})

describe('untilOf', () => {
  it("turns the screen's stop into the engine's stopping condition", () => {
    expect(untilOf(still({ stopBy: 'distilledFraction', stopValue: 0.6 }))).toEqual({ distillateMoles: 60 })
    expect(untilOf(still({ stopBy: 'potMoles', stopValue: 25 }))).toEqual({ potMoles: 25 })
    expect(untilOf(still({ stopBy: 'distillateMoles', stopValue: 30 }))).toEqual({ distillateMoles: 30 })
    expect(untilOf(still({ stopBy: 'potX1', stopValue: 0.1 }))).toEqual({ potX1: 0.1 })
    expect(untilOf(still({ stopBy: 'recovery1', stopValue: 0.9 }))).toEqual({ recovery1: 0.9 })
  })
})

describe('defaultStopValue', () => {
  it('starts each stop somewhere the still can reach', () => {
    expect([
      defaultStopValue('distilledFraction', 80, 0.3),
      defaultStopValue('distillateMoles', 80, 0.3),
      defaultStopValue('potMoles', 80, 0.3),
    ]).toEqual([0.6, 48, 32])
    expect([defaultStopValue('potX1', 80, 0.3), defaultStopValue('recovery1', 80, 0.3)]).toEqual([0.1, 0.9])
  })
})

describe('batchRun stops (benzene–toluene, ideal, 1 atm)', () => {
  // Checks are the still's own balances (exact): what leaves the pot is the distillate.
  it('stops a simple still at the pot composition asked for', () => {
    const b = still({ stopBy: 'potX1', stopValue: 0.15 })
    const run = batchRun(benzeneToluene, P, b)
    expect(run.end.potX1).toBeCloseTo(0.15, 6)
    expect(run.end.potMoles + run.end.distillateMoles).toBeCloseTo(100, 9)
    expect(stopNote(run, b)).toBeNull()
  })

  it('stops a column at the recovery of component 1 asked for, with the component-1 balance closing', () => {
    const b = still({ stagesAbovePot: 3, R: 3, stopBy: 'recovery1', stopValue: 0.8 })
    const run = batchRun(benzeneToluene, P, b)
    expect(run.end.recovery1).toBeCloseTo(0.8, 6)
    expect(run.end.distillateMoles * run.end.distillateX1).toBeCloseTo(0.8 * 100 * 0.4, 6)
    expect(run.end.potMoles * run.end.potX1 + run.end.distillateMoles * run.end.distillateX1).toBeCloseTo(40, 6)
  })

  it('stops at mol left in the pot and at mol distilled', () => {
    expect(batchRun(benzeneToluene, P, still({ stopBy: 'potMoles', stopValue: 35 })).end.potMoles).toBeCloseTo(35, 9)
    expect(
      batchRun(benzeneToluene, P, still({ stagesAbovePot: 2, stopBy: 'distillateMoles', stopValue: 20 })).end
        .distillateMoles,
    ).toBeCloseTo(20, 9)
  })

  it('notes a stop met only as the pot runs practically dry', () => {
    const b = still({ stopBy: 'recovery1', stopValue: 0.99999 })
    const run = batchRun(benzeneToluene, P, b)
    expect(stopNote(run, b)).toMatch(
      /^This stop is reached only when the pot is practically dry \(.+ of the charge left\); a real still is not run that far\.$/,
    )
  })
})

describe('batchFailureText', () => {
  const fail = (b: BatchInputs) => {
    try {
      batchRun(benzeneToluene, P, b)
    } catch (e) {
      return batchFailureText(e, b, names)
    }
    throw new Error('expected the run to fail')
  }

  it('explains why a column cannot enrich the pot, with the reachable range', () => {
    expect(fail(still({ stagesAbovePot: 3, R: 3, stopBy: 'potX1', stopValue: 0.6 }))).toBe(
      'The still cannot reach a pot x₁ of 0.6. With 3 stages above the pot at R = 3 the distillate is richer in benzene than the pot, so the pot only gets leaner in it: from x₁ = 0.4 it heads towards pure toluene (x₁ = 0) and never passes it. Choose a pot x₁ between 0.000 and 0.400, or stop by another condition.',
    )
  })

  it('says the same for a simple still in its own words', () => {
    expect(fail(still({ stopBy: 'potX1', stopValue: 0.5 }))).toBe(
      'The still cannot reach a pot x₁ of 0.5. The first vapour of this charge is richer in benzene than the liquid, so the pot only gets leaner in it: from x₁ = 0.4 it heads towards pure toluene (x₁ = 0) and never passes it. Choose a pot x₁ between 0.000 and 0.400, or stop by another condition.',
    )
  })

  it("keeps the engine's words for other errors", () => {
    expect(batchFailureText(new Error('R must be a positive, finite reflux ratio L/D.'), still({}), names)).toBe(
      'R must be a positive, finite reflux ratio L/D.',
    )
  })
})
