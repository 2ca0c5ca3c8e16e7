import { describe, expect, it } from 'vitest'
import { DESIGN_CAUTION } from '../columns/design-notes.js'
import { margulesTable } from '../columns/test-curves.js'
import { batchRectification } from './rectification.js'
import { simpleBatchDistillation } from './simple-batch.js'

const charge = { moles: 100, x1: 0.5 }

describe('simpleBatchDistillation', () => {
  const r = simpleBatchDistillation({ alpha: 2.5 }, { charge, until: { distillateMoles: 60 }, frames: 61 })
  it('emits evenly spaced frames from the charge to the end state', () => {
    expect(r.frames).toHaveLength(61)
    expect(r.frames[0]).toMatchObject({ distilledFraction: 0, potMoles: 100, potX1: 0.5 })
    expect(r.frames[30].distilledFraction).toBeCloseTo(0.3, 12)
    expect(r.end.distillateMoles).toBeCloseTo(60, 9)
    expect(r.caution).toBe(DESIGN_CAUTION)
    expect(r.assumptions).toContain('vapour removed as soon as it forms')
  })
  it('keeps the component balance closed in every frame', () => {
    for (const f of r.frames) {
      const D = 100 - f.potMoles
      expect(f.potMoles * f.potX1 + D * f.cumulativeDistillateX1).toBeCloseTo(50, 9)
    }
  })
  it('pot and distillate both get leaner as the run goes on', () => {
    for (let i = 1; i < r.frames.length; i++) {
      expect(r.frames[i].potX1).toBeLessThan(r.frames[i - 1].potX1)
      expect(r.frames[i].instantaneousDistillateY1).toBeLessThan(r.frames[i - 1].instantaneousDistillateY1)
    }
  })
  it('stops on recovery and on pot composition', () => {
    expect(simpleBatchDistillation({ alpha: 2.5 }, { charge, until: { recovery1: 0.9 } }).end.recovery1).toBeCloseTo(
      0.9,
      9,
    )
    expect(simpleBatchDistillation({ alpha: 2.5 }, { charge, until: { potX1: 0.1 } }).end.potX1).toBeCloseTo(0.1, 9)
    expect(simpleBatchDistillation({ alpha: 2.5 }, { charge, until: { potMoles: 25 } }).end.potMoles).toBeCloseTo(25, 9)
  })
  it('above a minimum-boiling azeotrope the pot gets richer in component 1', () => {
    // invented curve: symmetric Margules, azeotrope at x1 = 0.5
    const r2 = simpleBatchDistillation(
      { table: margulesTable(1.2, 1) },
      { charge: { moles: 10, x1: 0.7 }, until: { potX1: 0.9 } },
    )
    expect(r2.end.distillateX1).toBeLessThan(0.7)
    expect(() =>
      simpleBatchDistillation(
        { table: margulesTable(1.2, 1) },
        { charge: { moles: 10, x1: 0.7 }, until: { potX1: 0.4 } },
      ),
    ).toThrow('The pot cannot reach x1 = 0.4: starting from 0.7 it moves towards pure component 1 (x1 = 1).')
    expect(() =>
      simpleBatchDistillation(
        { table: margulesTable(1.2, 1) },
        { charge: { moles: 10, x1: 0.3 }, until: { potX1: 0.6 } },
      ),
    ).toThrow('The pot cannot reach x1 = 0.6: starting from 0.3 it moves towards pure component 2 (x1 = 0).')
  })

  it.each([
    [
      { charge: { moles: 0, x1: 0.5 }, until: { potMoles: 1 } },
      'charge.moles must be a positive number of moles; got 0.',
    ],
    [
      { charge: { moles: 10, x1: 1 }, until: { potMoles: 1 } },
      'charge.x1 must be a mole fraction strictly between 0 and 1; got 1.',
    ],
    [
      { charge, until: { potMoles: 100 } },
      'until.potMoles must lie strictly between 0 and the charge (100 mol); got 100.',
    ],
    [
      { charge, until: { distillateMoles: -1 } },
      'until.distillateMoles must lie strictly between 0 and the charge (100 mol); got -1.',
    ],
    [{ charge, until: { recovery1: 1 } }, 'until.recovery1 must lie strictly between 0 and 1; got 1.'],
    [
      { charge, until: { potX1: 0.6 } },
      'The pot cannot reach x1 = 0.6: starting from 0.5 it moves towards pure component 2 (x1 = 0).',
    ],
    [
      { charge, until: {} },
      'Give exactly one stopping condition in until: potMoles, potX1, distillateMoles or recovery1.',
    ],
    [
      { charge, until: { potMoles: 5, potX1: 0.1 } },
      'Give exactly one stopping condition in until: potMoles, potX1, distillateMoles or recovery1.',
    ],
    [
      { charge, until: { time: 3 } },
      "Unknown stopping condition 'time'; use potMoles, potX1, distillateMoles or recovery1.",
    ],
    [{ charge, until: { potMoles: 5 }, frames: 1 }, 'frames must be a whole number from 2 to 5000; got 1.'],
  ])('rejects %j', (options, message) => {
    expect(() => simpleBatchDistillation({ alpha: 2.5 }, options as never)).toThrow(message)
  })
})

describe('batchRectification', () => {
  it('with one stage (the pot alone) it is simple distillation', () => {
    const a = batchRectification({ alpha: 2.5 }, { charge, stages: 1, R: 3, until: { distillateMoles: 40 } })
    const b = simpleBatchDistillation({ alpha: 2.5 }, { charge, until: { distillateMoles: 40 } })
    expect(a.end.potX1).toBeCloseTo(b.end.potX1, 9)
    expect(a.end.distillateX1).toBeCloseTo(b.end.distillateX1, 9)
  })
  it('more stages and more reflux give a purer distillate', () => {
    const run = (stages: number, R: number) =>
      batchRectification({ alpha: 2.5 }, { charge, stages, R, until: { distillateMoles: 30 } }).end.distillateX1
    expect(run(5, 3)).toBeGreaterThan(run(3, 3))
    expect(run(5, 6)).toBeGreaterThan(run(5, 3))
  })
  it('the first frame distillate satisfies the stage stepping exactly (quasi-steady)', () => {
    const r = batchRectification({ alpha: 2 }, { charge, stages: 2, R: 1, until: { potMoles: 50 }, frames: 2 })
    // two stages, R = 1: y_pot = 2·0.5/1.5, the top liquid x_top = (y_pot − xD/2)/(1/2), and xD = y(x_top)
    const xD = r.frames[0].instantaneousDistillateY1
    const xTop = 2 * (2 / 3 - xD / 2)
    expect((2 * xTop) / (1 + xTop)).toBeCloseTo(xD, 12)
  })
  it.each([
    [
      { stages: 0, R: 3 },
      'stages must be a whole number of theoretical stages from 1 to 200 (the pot counts as one); got 0.',
    ],
    [
      { stages: 2.5, R: 3 },
      'stages must be a whole number of theoretical stages from 1 to 200 (the pot counts as one); got 2.5.',
    ],
    [
      { stages: 5, R: Infinity },
      'R must be a positive, finite reflux ratio L/D (at total reflux nothing is collected); got Infinity.',
    ],
  ])('rejects %j', (column, message) => {
    expect(() => batchRectification({ alpha: 2.5 }, { charge, ...column, until: { potMoles: 5 } })).toThrow(message)
  })
})
