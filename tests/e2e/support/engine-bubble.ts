/**
 * The engine's bubble point for a model as the parameters export gives it (tests/e2e/engineer-vapour.spec.ts):
 * argv[2] is JSON { vaporPressure, activity, vapor?, T?, P?, x1 }; with T the bubble pressure, with P the bubble
 * temperature, each under the vapour given (γ–φ for a virial vapour) and under an ideal vapour.
 * Run with tsx; prints JSON. (A separate process, so the browser tests need not load the engine.)
 */
import {
  bubblePressure,
  bubbleTemperature,
  type ActivityModel,
  type BinarySystem,
  type VaporModel,
  type VaporPressureModel,
} from '../../../packages/thermo/src/index.js'

const q = JSON.parse(process.argv[2]) as {
  vaporPressure: (VaporPressureModel & { source?: string; component?: unknown })[]
  activity: ActivityModel
  vapor?: VaporModel
  T?: number
  P?: number
  x1: number
}
const vp = q.vaporPressure.map(({ source: _s, component: _c, ...m }) => m as VaporPressureModel) as [
  VaporPressureModel,
  VaporPressureModel,
]
const system = (vapor?: VaporModel): BinarySystem => ({
  vaporPressure: vp,
  activity: q.activity,
  ...(vapor?.kind === 'virial' ? { vapor } : {}),
})
const at = (s: BinarySystem) =>
  q.T !== undefined ? bubblePressure(s, { T: q.T, x1: q.x1 }) : bubbleTemperature(s, { P: q.P!, x1: q.x1 })
const own = at(system(q.vapor))
const ideal = at(system())
process.stdout.write(
  JSON.stringify({
    P: 'P' in own ? own.P : q.P,
    T: 'T' in own ? own.T : q.T,
    y1: own.y1,
    idealP: 'P' in ideal ? ideal.P : q.P,
    idealT: 'T' in ideal ? ideal.T : q.T,
  }),
)
