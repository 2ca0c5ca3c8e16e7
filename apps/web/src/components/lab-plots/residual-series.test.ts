import { bubbleTemperature, fitBinary, type BinarySystem, type VaporPressureModel } from '@ebullio/thermo'
import { describe, expect, it } from 'vitest'
import type { Fit, Point } from '../../api/datasets'
import { residualOption } from '../plots/residual-option'
import { residualSeries } from './residual-series'
import { PA_PER } from '../../stores/preferences'

// Antoine constants of acetone and methanol: Smith, Van Ness & Abbott, Introduction to Chemical Engineering
// Thermodynamics, Table B.2 (ln P/kPa, t/°C). Margules A12 = A21 = 0.58 is an invented round value: the check
// is the sign convention, not the chemistry.
const antoine = (A: number, B: number, C: number): VaporPressureModel => ({
  kind: 'antoine',
  A,
  B,
  C,
  log: 'ln',
  pressureUnit: 'kPa',
  temperatureUnit: 'C',
})
const system: BinarySystem = {
  vaporPressure: [antoine(14.3145, 2756.22, 228.06), antoine(16.5785, 3638.27, 239.5)],
  activity: { kind: 'margules', A12: 0.58, A21: 0.58 },
}

describe('residual plot option: measured − calculated', () => {
  it('a point deliberately raised by 1 K is drawn at about +1 K', () => {
    const P = 101325
    const xs = [0.05, 0.12, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.88, 0.95]
    const exact = xs.map((x1) => ({ x1, ...bubbleTemperature(system, { P, x1 }) }))
    const raised = 5
    const measured = exact.map((e, i) => ({ T: e.T + (i === raised ? 1 : 0), P, x1: e.x1, y1: e.y1 }))
    const r = fitBinary({ points: measured, vaporPressure: system.vaporPressure, model: 'margules' })
    const points = measured.map(
      (m, i) =>
        ({
          id: `p${i}`,
          seq: i + 1,
          sampleLabel: `S-${i}`,
          temperatureK: m.T,
          pressurePa: m.P,
          x1: m.x1,
          y1: m.y1,
          x1Uncertainty: 0.002,
          y1Uncertainty: 0.003,
          excluded: false,
        }) as unknown as Point,
    )
    const fit = {
      id: 'f1',
      model: 'margules',
      residuals: r.residuals.map((res, i) => ({ pointId: `p${i}`, ...res })),
      pointIds: points.map((p) => p.id),
    } as unknown as Fit
    const series = residualSeries('dT', { fits: [fit], points, visible: ['f1'], nameOf: () => 'Margules' })
    const option = residualOption({
      title: 'ΔT',
      series,
      quantity: 'ΔT / K',
      digits: 3,
      names: ['acetone', 'methanol'],
    })
    const scatter = (option.series as { type: string; data: { value: number[]; pointId: string }[] }[])[0]
    const drawn = scatter.data.find((d) => d.pointId === `p${raised}`)!.value[1]
    // The fit leans a little towards the raised point, so a bit under 1 K; the sign is what this checks.
    expect(drawn).toBeGreaterThan(0.7)
    expect(drawn).toBeLessThan(1.05)
    expect(drawn).toBeCloseTo(r.residuals[raised].dT!, 12)
  })
})

describe('pressure residuals (fits on pressures, isothermal data)', () => {
  const points = [0.2, 0.5, 0.8].map(
    (x1, i) => ({ id: `q${i}`, x1, excluded: false, temperatureK: 323.15, pressurePa: 8e4 }) as unknown as Point,
  )
  const fit = {
    id: 'f2',
    model: 'wilson',
    // residuals as the engine stores them: dP in Pa (measured − calculated), no dT
    residuals: [
      { pointId: 'q0', dP: 100, dy: 0.001 },
      { pointId: 'q1', dP: -40, dy: null },
      { pointId: 'q2', dP: 0, dy: -0.002 },
    ],
    pointIds: ['q0', 'q1', 'q2'],
  } as unknown as Fit
  const o = { fits: [fit], points, visible: ['f2'], nameOf: () => 'Wilson' }

  it('draws ΔP in the chosen pressure unit with its sign, and no ΔT series at all', () => {
    // the preferences store's own conversion: 1 kPa = 1000 Pa, 1 mmHg = 133.322387415 Pa (packages/thermo units.ts)
    const kPa = residualSeries('dP', { ...o, scaleDP: (v) => v / PA_PER.kPa })
    expect(kPa[0].points.map((p) => p.residual)).toEqual([0.1, -0.04, 0])
    const mmHg = residualSeries('dP', { ...o, scaleDP: (v) => v / PA_PER.mmHg })
    expect(mmHg[0].points[0].residual).toBeCloseTo(100 / 133.322387415, 9)
    expect(residualSeries('dT', o)).toEqual([])
    // a point without a vapour residual is left out of the Δy₁ series, not drawn at 0
    expect(residualSeries('dy', o)[0].points.map((p) => p.id)).toEqual(['q0', 'q2'])
  })
})
