import { describe, expect, it } from 'vitest'
import {
  activityCoefficients,
  bubblePressure,
  bubbleTemperature,
  dewTemperature,
  findAzeotrope,
  phaseDiagram,
  saturationTemperature,
  vaporPressure,
  type BinarySystem,
  type VaporPressureModel,
} from '../../src/index.js'
import { b2 } from './helpers/constants.js'

// Exact messages for bad input: the UI shows them as they are.
const system: BinarySystem = { vaporPressure: [b2('benzene'), b2('toluene')], activity: { kind: 'ideal' } }
const cases: [string, () => unknown, string][] = [
  [
    'x1 above 1',
    () => bubbleTemperature(system, { P: 101325, x1: 1.2 }),
    'Liquid mole fraction x1 must be between 0 and 1; got 1.2.',
  ],
  [
    'x1 NaN',
    () => bubblePressure(system, { T: 350, x1: NaN }),
    'Liquid mole fraction x1 must be between 0 and 1; got NaN.',
  ],
  [
    'y1 negative',
    () => dewTemperature(system, { P: 101325, y1: -0.1 }),
    'Vapour mole fraction y1 must be between 0 and 1; got -0.1.',
  ],
  [
    'zero pressure',
    () => bubbleTemperature(system, { P: 0, x1: 0.5 }),
    'Pressure must be a positive number of pascals; got 0.',
  ],
  [
    'infinite pressure',
    () => bubbleTemperature(system, { P: Infinity, x1: 0.5 }),
    'Pressure must be a positive number of pascals; got Infinity.',
  ],
  [
    'negative temperature',
    () => bubblePressure(system, { T: -5, x1: 0.5 }),
    'Temperature must be a positive number of kelvins; got -5.',
  ],
  [
    'no condition',
    () => findAzeotrope(system, {} as { P: number }),
    'Give either a pressure P (Pa) for a T–x–y diagram or a temperature T (K) for a P–x–y diagram.',
  ],
  [
    'diagram points',
    () => phaseDiagram(system, { P: 101325 }, { points: 2 }),
    'The number of diagram points must be a whole number from 3 to 10001; got 2.',
  ],
  [
    'NRTL alpha',
    () => activityCoefficients({ kind: 'nrtl', b12: 1, b21: 1, alpha: 0 }, { x1: 0.5, T: 300 }),
    'The NRTL non-randomness parameter alpha must be between 0 and 1; got 0.',
  ],
  [
    'Van Laar signs',
    () => activityCoefficients({ kind: 'van-laar', A12: 1, A21: -1 }, { x1: 0.5, T: 300 }),
    'Van Laar parameters A12 and A21 must have the same sign.',
  ],
  [
    'Wilson volumes',
    () => activityCoefficients({ kind: 'wilson', a12: 1, a21: 1, V1: 0, V2: 18 }, { x1: 0.5, T: 300 }),
    'Wilson needs positive liquid molar volumes V1 and V2 (cm³/mol).',
  ],
  [
    'unknown model',
    () => activityCoefficients({ kind: 'regular' } as never, { x1: 0.5, T: 300 }),
    'Unknown activity model kind "regular".',
  ],
  [
    'Antoine NaN',
    () => vaporPressure({ ...b2('water'), A: NaN }, 300),
    'Antoine constants A, B and C must be finite numbers.',
  ],
  [
    'Antoine unit',
    () => vaporPressure({ ...b2('water'), pressureUnit: 'psi' } as unknown as VaporPressureModel, 300),
    'Unknown Antoine pressure unit "psi"; use Pa, kPa, bar, mmHg or atm.',
  ],
  [
    'Antoine pole',
    () => vaporPressure(b2('water'), 40),
    'The Antoine equation has no value at 40 K: T + C is zero or negative there.',
  ],
  [
    'beyond Antoine',
    () => saturationTemperature(b2('water'), 1e12),
    'No saturation temperature at 1000000000000 Pa: the pressure is beyond what this vapour-pressure correlation can reach.',
  ],
  [
    'Clausius–Clapeyron',
    () => vaporPressure({ kind: 'clausius-clapeyron', Tref: 373.15, Pref: 101325, dHvap: -1 }, 300),
    'Clausius–Clapeyron needs a positive Tref (K), Pref (Pa) and enthalpy of vaporization (J/mol).',
  ],
  [
    'pressure no liquid can boil at',
    () => bubbleTemperature(system, { P: 1e12, x1: 0.5 }),
    'The bubble-temperature calculation did not converge at x1 = 0.5 and 1000000000000 Pa; check the vapour-pressure constants and activity parameters.',
  ],
  [
    'one model',
    () =>
      bubbleTemperature({ vaporPressure: [b2('water')], activity: { kind: 'ideal' } } as never, { P: 1e5, x1: 0.5 }),
    'A binary system needs two vapour-pressure models and an activity model.',
  ],
]

describe('bad input is refused with an exact message', () => {
  for (const [what, call, message] of cases) {
    it(what, () => expect(call).toThrow(message))
  }
})
