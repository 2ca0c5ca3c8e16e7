import { parse } from 'csv-parse/sync'
import { dewTemperature, type BinarySystem } from '@ebullio/thermo'
import { describe, expect, it } from 'vitest'
import {
  ALPHA_VARIES_RATIO,
  curveTableCsv,
  cutsOf,
  diagramsAt,
  measuredForPlot,
  minimumStages,
  panelWarnings,
  tidyWarnings,
  type StillFrame,
} from './design-model'

// Antoine constants, ln(P/kPa) = A − B/(t/°C + C): Smith, Van Ness & Abbott, 7th ed., Table B.2
// (benzene A,B,C read in print; toluene from memory, it reproduces the table's normal boiling point).
const benzeneToluene: BinarySystem = {
  vaporPressure: [
    { kind: 'antoine', A: 13.7819, B: 2726.81, C: 217.572, log: 'ln', pressureUnit: 'kPa', temperatureUnit: 'C' },
    { kind: 'antoine', A: 13.932, B: 3056.96, C: 217.625, log: 'ln', pressureUnit: 'kPa', temperatureUnit: 'C' },
  ],
  activity: { kind: 'ideal' },
}

describe('diagramsAt (benzene–toluene, ideal, 101.325 kPa)', () => {
  const d = diagramsAt(benzeneToluene, 101325)

  it('puts the pure ends at the normal boiling points of SVNA 7th ed. Table B.2 (80.0 and 110.6 °C, ±0.15 K)', () => {
    expect(Math.abs(d.pure.T1 - 273.15 - 80.0)).toBeLessThan(0.15)
    expect(Math.abs(d.pure.T2 - 273.15 - 110.6)).toBeLessThan(0.15)
  })

  it('boils an equimolar liquid near 92 °C with 70–75 % benzene in the first vapour (common practice, no source)', () => {
    const mid = d.table.find((r) => r.x1 === 0.5)!
    expect(Math.abs(mid.T - 273.15 - 92)).toBeLessThan(1.5)
    expect(mid.y1).toBeGreaterThan(0.7)
    expect(mid.y1).toBeLessThan(0.75)
  })

  it('finds no azeotrope in an ideal pair and keeps α above 1', () => {
    expect(d.azeotrope).toBeNull()
    expect(Math.min(...d.alpha)).toBeGreaterThan(1)
  })

  it('writes the curve table with a header, a caution line and one row per computed point', () => {
    const lines = curveTableCsv(d, ['benzene', 'toluene'], 'Ideal').trim().split('\n')
    expect(lines[0]).toBe('# Ebullio curve table; benzene (1) + toluene (2); model Ideal; P = 101.3250 kPa')
    expect(lines[1]).toBe('# Preliminary estimate from equilibrium data; not an engineered design.')
    expect(lines[2]).toBe('x1,y1,t_k,t_c,alpha12')
    expect(lines).toHaveLength(3 + d.x1.length)
  })

  it('writes in each row the numbers the engine computed, at the printed precision, and they are VLE', () => {
    const rows = (
      parse(curveTableCsv(d, ['benzene', 'toluene'], 'Ideal'), { comment: '#', from_line: 2 }) as string[][]
    ).map((r) => r.map(Number))
    expect(rows).toHaveLength(d.x1.length)
    rows.forEach(([x1, y1, tK, tC, alpha], i) => {
      expect(Math.abs(x1 - d.x1[i])).toBeLessThanOrEqual(5e-7)
      expect(Math.abs(y1 - d.y1[i])).toBeLessThanOrEqual(5e-7)
      expect(Math.abs(tK - d.T[i])).toBeLessThanOrEqual(5e-4)
      expect(Math.abs(tC - (tK - 273.15))).toBeLessThanOrEqual(1e-3)
      expect(Math.abs(alpha - d.alpha[i])).toBeLessThanOrEqual(5e-6)
    })
    // The equimolar row boils near 92 °C (common practice, no source) and its vapour's dew point, found by the
    // engine's other solver, is the same temperature.
    const mid = rows.find(([x1]) => x1 === 0.5)!
    expect(Math.abs(mid[3] - 92)).toBeLessThan(1.5)
    expect(Math.abs(dewTemperature(benzeneToluene, { P: 101325, y1: mid[1] }).T - mid[2])).toBeLessThan(2e-3)
  })

  it('keeps a hostile component name inside its comment cell (no cell of its own starts a formula)', () => {
    const text = curveTableCsv(d, ['x,=cmd|"/c calc"!A1', 'toluene'], 'Ideal')
    const first = parse(text, { relax_column_count: true })[0] as string[]
    expect(first).toHaveLength(1)
    expect(first[0].startsWith('# Ebullio curve table; x,=cmd')).toBe(true)
  })
})

describe('cutsOf', () => {
  // Synthetic frames (invented): cumulative distillate composition falling as the still runs.
  const frames: StillFrame[] = Array.from({ length: 11 }, (_, i) => ({
    distilledFraction: i * 0.05,
    potMoles: 100 - i * 5,
    potX1: 0.5 - i * 0.02,
    potT: 350 + i,
    instantaneousDistillateY1: 0.9 - i * 0.03,
    cumulativeDistillateX1: 0.9 - i * 0.015,
  }))

  it('splits the distillate into equal cuts whose component-1 balance matches the collected total', () => {
    const cuts = cutsOf(frames, 100, 5)
    expect(cuts).toHaveLength(5)
    expect(cuts.map((c) => c.moles)).toEqual([10, 10, 10, 10, 10].map((v) => expect.closeTo(v, 10)))
    const collected1 = cuts.reduce((s, c) => s + c.moles * c.x1, 0)
    const last = frames.at(-1)!
    expect(collected1).toBeCloseTo(last.cumulativeDistillateX1 * last.distilledFraction * 100, 10)
    expect(cuts[0].potTStart).toBe(350)
    expect(cuts[4].potTEnd).toBe(360)
  })
})

describe('tidyWarnings', () => {
  it('folds per-temperature range warnings into one line', () => {
    const ws = [
      'methanol: 373.13 K (99.98 °C) is outside the range of its vapour-pressure correlation (−11 to 83 °C); the value is extrapolated.',
      'methanol: 372.99 K (99.84 °C) is outside the range of its vapour-pressure correlation (−11 to 83 °C); the value is extrapolated.',
    ]
    expect(tidyWarnings(ws)).toEqual([
      'methanol: part of this calculation is outside the range of its vapour-pressure correlation (−11 to 83 °C); the value is extrapolated.',
    ])
  })
})

describe('measuredForPlot', () => {
  it('flags the points the chosen fit marked, by point id or by position', () => {
    const p = (id: string) => ({
      id,
      seq: 1,
      sampleLabel: id,
      temperatureK: 330,
      pressurePa: 101325,
      x1: 0.3,
      x1Uncertainty: 0.002,
      y1: 0.5,
      y1Uncertainty: 0.003,
      excluded: false,
      exclusionReason: null,
    })
    const m = {
      points: [p('a'), p('b'), p('c')],
      fits: [
        { id: 'f1', pointIds: ['a', 'b', 'c'], residuals: [{ flagged: false }, { flagged: true }, { flagged: false }] },
        { id: 'f2', pointIds: ['a', 'b', 'c'], residuals: [{ pointId: 'c', outlier: true }] },
      ],
    }
    expect(measuredForPlot(m, 'f1').map((x) => x.outlier)).toEqual([false, true, false])
    expect(measuredForPlot(m, 'f2').map((x) => x.outlier)).toEqual([false, false, true])
    expect(measuredForPlot(m, null).some((x) => x.outlier)).toBe(false)
  })
})

describe('minimumStages (acetone / methanol, the demo system: SVNA 7th ed. Table 12.5 Wilson, Table B.2 Antoine, 101.325 kPa)', () => {
  const CAL = 4.184 // J per thermochemical calorie
  const acetoneMethanol: BinarySystem = {
    vaporPressure: [
      {
        kind: 'antoine',
        A: 14.3145,
        B: 2756.22,
        C: 228.06,
        log: 'ln',
        pressureUnit: 'kPa',
        temperatureUnit: 'C',
        range: [-26, 77],
      },
      {
        kind: 'antoine',
        A: 16.5785,
        B: 3638.27,
        C: 239.5,
        log: 'ln',
        pressureUnit: 'kPa',
        temperatureUnit: 'C',
        range: [-11, 83],
      },
    ],
    activity: { kind: 'wilson', a12: -161.88 * CAL, a21: 583.11 * CAL, V1: 74.05, V2: 40.73 },
    names: ['acetone', 'methanol'],
  }
  // The column screen's default targets for this system (distillate short of the azeotrope near x1 = 0.79).
  const targets = { xF: 0.41, q: 1, xD: 0.76, xB: 0.05 }
  const m = minimumStages(acetoneMethanol, 101325, targets)

  /**
   * Total-reflux stepping done independently, point by point with the engine's dew point (the definition of
   * the construction, common practice, no source): the operating line is the diagonal, so each stage's liquid
   * is the dew-point liquid of the vapour leaving it, and that liquid's composition is the vapour of the stage
   * below; the last stage is counted as the fraction of its step needed to reach xB.
   */
  function steppedByHand(xD: number, xB: number): number {
    let y = xD
    for (let n = 1; n < 100; n++) {
      const x = dewTemperature(acetoneMethanol, { P: 101325, y1: y }).x1
      if (x <= xB) return n - 1 + (y - xB) / (y - x)
      y = x
    }
    throw new Error('did not reach xB')
  }

  it('steps at total reflux on the model curve: the same count as stepping by hand with dew points (±0.05 stage)', () => {
    expect(Math.abs(m.Nmin - steppedByHand(0.76, 0.05))).toBeLessThan(0.05)
    expect(m.wholeStages).toBe(Math.ceil(m.Nmin - 1e-9))
  })

  it('puts the Fenske constant-α figure beside it, lower, and flags how strongly α varies between the targets', () => {
    // Fenske with the geometric-mean α: ln[(xD/(1 − xD))·((1 − xB)/xB)] / ln √(α_top·α_bottom).
    const f = m.fenske
    expect(f.Nmin).toBeCloseTo(
      Math.log((0.76 / 0.24) * (0.95 / 0.05)) / Math.log(Math.sqrt(f.alphaTop * f.alphaBottom)),
      10,
    )
    expect(f.Nmin).toBeLessThan(m.Nmin - 2)
    expect(m.alphaRange.min).toBeCloseTo(Math.min(f.alphaTop, f.alphaBottom), 12)
    expect(m.alphaRange.max / m.alphaRange.min).toBeGreaterThan(ALPHA_VARIES_RATIO)
    expect(m.alphaVaries).toBe(true)
  })

  it('does not flag a nearly constant α (benzene–toluene, ideal)', () => {
    const ideal = minimumStages(benzeneToluene, 101325, { xF: 0.5, q: 1, xD: 0.95, xB: 0.05 })
    expect(ideal.alphaVaries).toBe(false)
    // With α almost constant, stepping and Fenske agree closely (common practice, no source): within 0.3 stage.
    expect(Math.abs(ideal.Nmin - ideal.fenske.Nmin)).toBeLessThan(0.3)
  })
})

describe('panelWarnings', () => {
  it('leaves out the range warnings (summarised once per screen) and keeps the others', () => {
    const ws = [
      'n-hexane: temperatures from 68.70 to 98.40 °C reach outside the range of its vapour-pressure correlation (-19 to 92 °C); values there are extrapolated.',
      'xD is at or below the vapour in equilibrium with the feed: any reflux ratio reaches it (Rmin = 0).',
    ]
    expect(panelWarnings(ws)).toEqual([ws[1]])
  })
})
