import { describe, expect, it } from 'vitest'
import { fitBinary, type BinaryPoint, type FitBinaryOptions } from '../../src/index.js'
import { b2 } from './helpers/constants.js'

// Exact messages for bad fitting input (the upload screen shows them as they are).
const vaporPressure: FitBinaryOptions['vaporPressure'] = [b2('benzene'), b2('toluene')]
const good: BinaryPoint[] = [
  { T: 370, P: 101325, x1: 0.2, y1: 0.4 },
  { T: 365, P: 101325, x1: 0.5, y1: 0.7 },
  { T: 358, P: 101325, x1: 0.8, y1: 0.9 },
]
const withPoint = (p: Partial<BinaryPoint>): BinaryPoint[] => [good[0], { ...good[1], ...p }, good[2]]

const cases: [string, () => unknown, string][] = [
  [
    'too few points',
    () => fitBinary({ points: good.slice(0, 2), vaporPressure, model: 'nrtl' }),
    'Fitting NRTL needs at least 3 points that are not excluded (one more than its 2 parameters); got 2.',
  ],
  [
    'too few after exclusion',
    () => fitBinary({ points: withPoint({ excluded: true }), vaporPressure, model: 'margules' }),
    'Fitting Margules needs at least 3 points that are not excluded (one more than its 2 parameters); got 2.',
  ],
  [
    'fitAlpha needs 4',
    () => fitBinary({ points: good, vaporPressure, model: 'nrtl', fitAlpha: true }),
    'Fitting NRTL needs at least 4 points that are not excluded (one more than its 3 parameters); got 3.',
  ],
  [
    'x1 above 1',
    () => fitBinary({ points: withPoint({ x1: 1.5 }), vaporPressure, model: 'nrtl' }),
    'Point 2: liquid mole fraction x1 must be between 0 and 1; got 1.5.',
  ],
  [
    'y1 negative',
    () => fitBinary({ points: withPoint({ y1: -0.01 }), vaporPressure, model: 'nrtl' }),
    'Point 2: vapour mole fraction y1 must be between 0 and 1, or null when no vapour was sampled; got -0.01.',
  ],
  [
    'T not finite',
    () => fitBinary({ points: withPoint({ T: NaN }), vaporPressure, model: 'nrtl' }),
    'Point 2: temperature must be a positive number of kelvins; got NaN.',
  ],
  [
    'P zero',
    () => fitBinary({ points: withPoint({ P: 0 }), vaporPressure, model: 'nrtl' }),
    'Point 2: pressure must be a positive number of pascals; got 0.',
  ],
  [
    'P negative',
    () => fitBinary({ points: withPoint({ P: -101325 }), vaporPressure, model: 'nrtl' }),
    'Point 2: pressure must be a positive number of pascals; got -101325.',
  ],
  [
    'sigma',
    () => fitBinary({ points: withPoint({ sigmaT: 0 }), vaporPressure, model: 'nrtl' }),
    'Point 2: sigmaT must be a positive number; got 0.',
  ],
  [
    'unknown model',
    () => fitBinary({ points: good, vaporPressure, model: 'unifac' as never }),
    'Unknown model "unifac"; choose margules, van-laar, wilson, nrtl or uniquac.',
  ],
  [
    'unknown objective',
    () => fitBinary({ points: good, vaporPressure, model: 'nrtl', objective: 'dew' as never }),
    'Unknown objective "dew"; choose bubble-point, bubble-pressure or activity.',
  ],
  [
    'Wilson volumes',
    () => fitBinary({ points: good, vaporPressure, model: 'wilson' }),
    'Wilson needs the liquid molar volumes V1 and V2 (cm³/mol) of both components.',
  ],
  [
    'fitAlpha on Wilson',
    () => fitBinary({ points: good, vaporPressure, model: 'wilson', V1: 89, V2: 107, fitAlpha: true }),
    'fitAlpha applies to NRTL only.',
  ],
  [
    'alpha',
    () => fitBinary({ points: good, vaporPressure, model: 'nrtl', alpha: 1.5 }),
    'The NRTL non-randomness parameter alpha must be between 0 and 1; got 1.5.',
  ],
]

describe('fitBinary refuses bad input with an exact message', () => {
  for (const [what, call, message] of cases) it(what, () => expect(call).toThrow(message))
})
