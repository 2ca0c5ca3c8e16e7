/**
 * The engine's own numbers for the isothermal journey (tests/e2e/isothermal.spec.ts): INVENTED P–x–y points of the
 * demo's acetone (1)/methanol (2) Wilson model (SVNA 7th ed. Table 12.5 parameters) at 50 °C, one of them raised by
 * 0.5 kPa, as typed into the grid; and the Wilson fit on pressures, its P–x–y band and the data-quality score of those
 * points.
 * Run with tsx; prints JSON. (A separate process, so the browser tests need not load the engine.)
 */
import {
  bubblePressure,
  dataQualityScore,
  fitBinary,
  predictionBandIsothermal,
  type BinaryPoint,
} from '../../../packages/thermo/src/index.js'
import { DEMO_COMPONENTS, DEMO_SYSTEMS, demoVaporPressure } from '../../../db/seeds/demo-systems.js'

const system = DEMO_SYSTEMS.find((s) => s.key === 'acetone-methanol')!
const vaporPressure = [demoVaporPressure('acetone'), demoVaporPressure('methanol')] as [
  ReturnType<typeof demoVaporPressure>,
  ReturnType<typeof demoVaporPressure>,
]
const T = 323.15
const XS = [0.06, 0.15, 0.25, 0.35, 0.45, 0.55, 0.65, 0.75, 0.85, 0.94]
/** as typed: T in °C, P in kPa to 3 decimals, y1 to 4 decimals, σP 0.05 kPa */
const typed = XS.map((x1, i) => {
  const b = bubblePressure({ vaporPressure, activity: system.activity }, { T, x1 })
  const kPa = Math.round(b.P) / 1000 + (i === 4 ? 0.5 : 0)
  return { t: '50', p: kPa.toFixed(3), x1: x1.toFixed(2), y1: b.y1.toFixed(4), up: '0.05' }
})
const points: BinaryPoint[] = typed.map((r) => ({
  T: Number(r.t) + 273.15,
  P: Number(r.p) * 1000,
  x1: Number(r.x1),
  y1: Number(r.y1),
  sigmaP: 50,
}))
const common = {
  model: 'wilson' as const,
  V1: DEMO_COMPONENTS.acetone.molarVolume,
  V2: DEMO_COMPONENTS.methanol.molarVolume,
  vaporPressure,
}
const fit = fitBinary({ ...common, objective: 'bubble-pressure', points })
const quality = dataQualityScore(points, { ...common, isothermal: true })
console.log(
  JSON.stringify({
    typed,
    rmsP: (fit as unknown as { rmsP: number }).rmsP,
    dP: fit.residuals.map((r) => (r as unknown as { dP: number }).dP),
    quality: quality.quality,
    // the Wilson fit's P–x–y band at 50 °C (51 points): its widest σP, Pa
    maxSigmaP: Math.max(...predictionBandIsothermal(fit, { T, points: 51 }).sigmaP),
  }),
)
