/**
 * Generates raw GC files for the demo (INVENTED DATA): gravimetric calibration standards and equilibrium
 * runs from a published activity model, with simulated weighing, barometer, thermometer and GC noise.
 * Deterministic (seeded), so the demo and the example files are the same on every machine.
 */
import { bubbleTemperature, type VaporModel } from '@ebullio/thermo'
import { gaussian, mulberry32 } from '@ebullio/thermo/random'
import { DEMO_COMPONENTS, demoVaporPressure, type DemoSystem } from './demo-systems.js'

/** Noise levels of the simulated lab (invented, typical of a careful lab: common practice, no source). */
export interface NoiseLevels {
  /** relative scatter of one injection's area ratio (0.006 = 0.6 %) */
  injectionRsd: number
  /** K */
  thermometer: number
  /** Pa, scatter of the barometric pressure around the nominal one */
  barometer: number
}
export const DEFAULT_NOISE: NoiseLevels = { injectionRsd: 0.006, thermometer: 0.05, barometer: 150 }

/** Peak areas of one injection for mole fraction x1 with response factor k (A1/A2 = k·x1/x2). */
function injectionAreas(x1: number, k: number, rand: () => number, rsd: number): [number, number] {
  const total = 4e5 * (0.8 + 0.4 * rand())
  const ratio = ((k * x1) / (1 - x1)) * Math.exp(rsd * gaussian(rand))
  const a2 = total / (1 + ratio)
  return [ratio * a2, a2]
}

const fmt = (v: number, digits: number) => v.toFixed(digits)

/** A calibration sheet: standards weighed as mass fractions, three injections each. */
export function calibrationCsv(system: DemoSystem, seed: number, noise = DEFAULT_NOISE): string {
  const rand = mulberry32(seed)
  const m1 = DEMO_COMPONENTS[system.light].molarMass
  const m2 = DEMO_COMPONENTS[system.heavy].molarMass
  const lines = ['standard,basis,fraction_1,injection,area_1,area_2']
  const targets = [0.02, 0.1, 0.25, 0.4, 0.55, 0.7, 0.85, 0.985]
  targets.forEach((xt, i) => {
    const w1 = Number(((xt * m1) / (xt * m1 + (1 - xt) * m2)).toFixed(4))
    const x1 = w1 / m1 / (w1 / m1 + (1 - w1) / m2)
    for (let inj = 1; inj <= 3; inj++) {
      const [a1, a2] = injectionAreas(x1, system.responseFactor, rand, noise.injectionRsd)
      lines.push(`CAL-${String(i + 1).padStart(2, '0')},mass,${fmt(w1, 4)},${inj},${fmt(a1, 1)},${fmt(a2, 1)}`)
    }
  })
  return lines.join('\n') + '\n'
}

/** One generated equilibrium state (true values before noise). */
export interface GeneratedState {
  label: string
  x1: number
  y1: number
  T: number
  P: number
  /** the two liquid layers [x1I, x1II] when the model's liquid boils as two layers (three-phase bubble point) */
  liquidPhases?: [number, number]
}

/**
 * A run sheet at a nominal pressure (Pa): liquid compositions spread over 0.04–0.96, each boiled at the
 * day's barometric pressure, T and y from the model's bubble point, two injections per phase. With `check`, two
 * injections of a check standard of that prepared x1 follow the samples (`phase` = check, the `check_x1` column),
 * drawn from their own random stream so the samples are the same with or without it. Where the model's
 * liquid boils as two layers the sample is marked `layers` = 2 and both layers are injected too (`upper` the
 * poorer in component 1, `lower` the richer).
 */
export function runCsv(
  system: DemoSystem,
  o: {
    seed: number
    pressurePa: number
    samples: number
    prefix: string
    noise?: NoiseLevels
    vapor?: VaporModel
    check?: { label: string; x1: number }
  },
): { csv: string; states: GeneratedState[] } {
  const noise = o.noise ?? DEFAULT_NOISE
  const rand = mulberry32(o.seed)
  const model = {
    vaporPressure: [demoVaporPressure(system.light), demoVaporPressure(system.heavy)] as [
      ReturnType<typeof demoVaporPressure>,
      ReturnType<typeof demoVaporPressure>,
    ],
    activity: system.activity,
    // a virial vapour makes the engine solve γ–φ bubble points
    ...(o.vapor ? { vapor: o.vapor } : {}),
  }
  const states: GeneratedState[] = []
  const body: string[][] = []
  for (let i = 0; i < o.samples; i++) {
    const x1 = 0.04 + (0.92 * (i + 0.5 * rand())) / Math.max(o.samples - 0.5, 1)
    const P = o.pressurePa + noise.barometer * gaussian(rand)
    // Inside the two-liquid gap the engine returns the three-phase bubble point with both layers.
    const bubble = bubbleTemperature(model, { P, x1 })
    const label = `${o.prefix}-${String(i + 1).padStart(2, '0')}`
    states.push({ label, x1, y1: bubble.y1, T: bubble.T, P, liquidPhases: bubble.liquidPhases })
    const tC = bubble.T - 273.15 + noise.thermometer * gaussian(rand)
    // Water-rich layers are the denser (lower) ones here, as with the demo's water/1-butanol (common practice).
    const layers = bubble.liquidPhases
      ? ([
          ['upper', bubble.liquidPhases[0]],
          ['lower', bubble.liquidPhases[1]],
        ] as const)
      : []
    for (const [phase, z] of [['liquid', x1], ['vapour', bubble.y1], ...layers] as const) {
      for (let inj = 1; inj <= 2; inj++) {
        const [a1, a2] = injectionAreas(z, system.responseFactor, rand, noise.injectionRsd)
        const first = phase === 'liquid' && inj === 1
        const cond = first ? `${fmt(tC, 2)},C,${fmt(P / 1000, 2)},kPa` : ',,,'
        body.push([`${label},${phase},${inj},${fmt(a1, 1)},${fmt(a2, 1)},${cond}`, first && layers.length ? '2' : ''])
      }
    }
  }
  // The layers column only when some sample boiled as two layers, so single-liquid files keep the plain layout.
  const twoLayers = states.some((s) => s.liquidPhases)
  const header =
    'sample,phase,injection,area_1,area_2,t_boil,t_unit,p_baro,p_unit' +
    (twoLayers ? ',layers' : '') +
    (o.check ? ',check_x1' : '')
  const lines = [header, ...body.map(([row, layers]) => (twoLayers ? `${row},${layers}` : row) + (o.check ? ',' : ''))]
  if (o.check) {
    const checkRand = mulberry32(o.seed + 7919)
    for (let inj = 1; inj <= 2; inj++) {
      const [a1, a2] = injectionAreas(o.check.x1, system.responseFactor, checkRand, noise.injectionRsd)
      lines.push(`${o.check.label},check,${inj},${fmt(a1, 1)},${fmt(a2, 1)},,,,${twoLayers ? ',' : ''},${o.check.x1}`)
    }
  }
  return { csv: lines.join('\n') + '\n', states }
}
