/**
 * The engine's own numbers for the demo's approved water/1-butanol fit, for the browser tests to compare with
 * what the screen shows. Run with tsx: `tsx tests/e2e/support/engine-water-butanol.ts '<activity JSON>' <P in Pa>`;
 * prints { azeotropes, threePhase } as JSON. (A separate process, so the browser tests need not load the engine.)
 */
import {
  findAzeotropes,
  phaseDiagram,
  type ActivityModel,
  type BinarySystem,
} from '../../../packages/thermo/src/index.js'
import { demoVaporPressure } from '../../../db/seeds/demo-systems.js'

const activity = JSON.parse(process.argv[2]) as ActivityModel
const P = Number(process.argv[3])
const system: BinarySystem = { vaporPressure: [demoVaporPressure('water'), demoVaporPressure('1-butanol')], activity }
const d = phaseDiagram(system, { P }, { points: 101 })
console.log(
  JSON.stringify({
    azeotropes: findAzeotropes(system, { P }),
    threePhase: d.kind === 'isobaric' ? d.threePhase : null,
  }),
)
