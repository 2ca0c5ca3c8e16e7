/**
 * Benchmarks of the design half of the engine (GC, columns, batch stills). Targets from the issue:
 * a 200-frame batch-still simulation under 20 ms median, a McCabe–Thiele run with an NRTL system under 5 ms median.
 * Each run starts from the BinarySystem (the equilibrium table is built inside the timed call, as in real use).
 * Run alone with `tsx bench/design.ts`, or import `runDesignBench` from bench/run.ts.
 */
import { pathToFileURL } from 'node:url'
import { batchRectification, simpleBatchDistillation } from '../src/batch/index.js'
import { mccabeThiele } from '../src/columns/index.js'
import { compositionFromAreas, fitCalibration } from '../src/gc/index.js'
import type { BinarySystem, VaporPressureModel } from '../src/types.js'

const P = 101325
const antoine = (A: number, B: number, C: number): VaporPressureModel => ({
  kind: 'antoine',
  A,
  B,
  C,
  log: 'ln',
  pressureUnit: 'kPa',
  temperatureUnit: 'C',
})
/** 1-propanol–water: NRTL from SVNA 7th ed. Table 12.5 (cal/mol × 4.184), Antoine from Table B.2. */
const propanolWater: BinarySystem = {
  vaporPressure: [antoine(16.1154, 3483.67, 205.807), antoine(16.3872, 3885.7, 230.17)],
  activity: { kind: 'nrtl', b12: 500.4 * 4.184, b21: 1636.57 * 4.184, alpha: 0.5081 },
}

/** One benchmark line: median and spread over `runs` timed calls after `warmup` untimed ones. */
export interface BenchLine {
  name: string
  medianMs: number
  p90Ms: number
  runs: number
  targetMs: number | null
}

function measure(name: string, fn: () => unknown, targetMs: number | null, runs = 60, warmup = 10): BenchLine {
  for (let i = 0; i < warmup; i++) fn()
  const times: number[] = []
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now()
    fn()
    times.push(performance.now() - t0)
  }
  times.sort((a, b) => a - b)
  return { name, medianMs: times[Math.floor(runs / 2)], p90Ms: times[Math.floor(runs * 0.9)], runs, targetMs }
}

const standards = [0.1, 0.25, 0.4, 0.55, 0.7, 0.85].map((x1, i) => ({
  composition: { x1 },
  injections: [0, 1, 2].map((j) => ({ area1: 1.37 * x1 * (1 + 0.004 * Math.sin(7 * i + j)), area2: 1 - x1 })),
}))

/** Run the design benchmarks, print a table and return the lines. */
export async function runDesignBench(): Promise<BenchLine[]> {
  const lines = [
    measure(
      'simple batch still, NRTL 1-propanol–water, 200 frames',
      () =>
        simpleBatchDistillation(
          { system: propanolWater, P },
          { charge: { moles: 100, x1: 0.2 }, until: { potX1: 0.01 }, frames: 200 },
        ),
      20,
    ),
    measure(
      'simple batch still, constant α, 200 frames',
      () =>
        simpleBatchDistillation(
          { alpha: 2.5 },
          { charge: { moles: 100, x1: 0.5 }, until: { potX1: 0.01 }, frames: 200 },
        ),
      20,
    ),
    measure(
      'batch rectification, NRTL, 10 stages, R = 5, 200 frames',
      () =>
        batchRectification(
          { system: propanolWater, P },
          { charge: { moles: 100, x1: 0.2 }, stages: 10, R: 5, until: { recovery1: 0.9 }, frames: 200 },
        ),
      20,
    ),
    measure(
      'McCabe–Thiele, NRTL 1-propanol–water, R = 1.3 Rmin',
      () => mccabeThiele({ system: propanolWater, P }, { xF: 0.1, q: 1, xD: 0.4, xB: 0.005, R: { timesMinimum: 1.3 } }),
      5,
    ),
    measure(
      'McCabe–Thiele, constant α = 2.5, R = 4',
      () => mccabeThiele({ alpha: 2.5 }, { xF: 0.45, q: 1, xD: 0.95, xB: 0.1, R: 4 }),
      5,
    ),
    measure(
      'GC calibration (6 standards × 3) + one sample',
      () =>
        compositionFromAreas(fitCalibration({ model: 'quadratic', standards }), {
          injections: standards[2].injections,
        }),
      null,
      500,
      50,
    ),
  ]
  console.log('Design benchmarks (median and 90th percentile, ms)')
  for (const l of lines) {
    const target =
      l.targetMs === null ? '' : `  target < ${l.targetMs} ms ${l.medianMs < l.targetMs ? 'met' : 'MISSED'}`
    console.log(
      `  ${l.name.padEnd(58)} ${l.medianMs.toFixed(3).padStart(8)} ${l.p90Ms.toFixed(3).padStart(8)}${target}`,
    )
  }
  return lines
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) await runDesignBench()
