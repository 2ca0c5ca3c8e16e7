import { describe, expect, it } from 'vitest'
import { bubbleTemperature } from '../equilibrium/index.js'
import type { BinarySystem, VaporPressureModel } from '../types.js'
import { fitBinary } from './fit-binary.js'

// Ethanol (1) / water (2): Antoine constants from Smith, Van Ness & Abbott, 7th ed., Table B.2. UNIQUAC structure
// parameters r, q of ethanol (2.1055, 1.972) and water (0.92, 1.40) as tabulated by Prausnitz et al., Molecular
// Thermodynamics of Fluid-Phase Equilibria (from memory). The energy parameters are invented for the round trip.
const vaporPressure: [VaporPressureModel, VaporPressureModel] = [
  { kind: 'antoine', A: 16.8958, B: 3795.17, C: 230.918, log: 'ln', pressureUnit: 'kPa', temperatureUnit: 'C' },
  { kind: 'antoine', A: 16.3872, B: 3885.7, C: 230.17, log: 'ln', pressureUnit: 'kPa', temperatureUnit: 'C' },
]
const uniquac = { r1: 2.1055, r2: 0.92, q1: 1.972, q2: 1.4 }
const truth: BinarySystem = { vaporPressure, activity: { kind: 'uniquac', a12: -350, a21: 1450, ...uniquac } }
// Deterministic scatter of about σT = 0.1 K and σy = 0.005 (the fit's default uncertainties).
const points = [0.03, 0.08, 0.15, 0.25, 0.35, 0.45, 0.55, 0.65, 0.75, 0.85, 0.92].map((x1, i) => {
  const b = bubbleTemperature(truth, { P: 101325, x1 })
  return { T: b.T + 0.1 * Math.sin(7.3 * i + 1), P: 101325, x1, y1: b.y1 + 0.005 * Math.cos(5.1 * i + 2) }
})

describe('fitBinary with UNIQUAC', () => {
  it('recovers the energy parameters within 3 standard errors from scattered points generated with them', () => {
    const fit = fitBinary({ points, vaporPressure, model: 'uniquac', uniquac })
    expect(fit.converged).toBe(true)
    expect(fit.activity).toMatchObject({ kind: 'uniquac', ...uniquac })
    const [a12, a21] = fit.parameters
    expect(a12.name).toBe('a12')
    expect(Math.abs(a12.value - -350)).toBeLessThan(3 * a12.standardError!)
    expect(Math.abs(a21.value - 1450)).toBeLessThan(3 * a21.standardError!)
    expect(a12.standardError!).toBeLessThan(150)
    expect(fit.rmsT).toBeLessThan(0.15)
    expect(fit.settings.uniquac).toEqual(uniquac)
  })

  it('refuses to fit without r and q, naming them', () => {
    expect(() => fitBinary({ points, vaporPressure, model: 'uniquac' })).toThrow(
      'UNIQUAC needs the structure parameters r1, r2, q1 and q2 (positive numbers) of both components.',
    )
  })
})
