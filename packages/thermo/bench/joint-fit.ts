/**
 * Benchmark of the joint fit (`pnpm bench` runs it after bench/run.ts): NRTL with temperature-dependent energies
 * b(T) = b + bT·(T − 298.15 K) over three 30-point data sets (40, 101.325 and 250 kPa), beside the same objective
 * through scipy.optimize.least_squares (bench/scipy-fit.py) when python3 with scipy is present.
 * Targets (issue): < 20 ms median and ≥ 20× faster than scipy at the same optimum.
 * Data: 1-propanol–water generated from SVNA 7th ed. Table 12.5 NRTL (invented temperature slopes) plus a
 * deterministic scatter of about 0.1 K and 0.005 in y.
 */
import { spawnSync } from 'node:child_process'
import { fileURLToPath } from 'node:url'
import { bubbleTemperature, fitJoint, type BinaryPoint, type BinarySystem } from '../src/index.js'
import { compileVaporPressure } from '../src/vapor-pressure/compiled.js'

const alpha = 0.5081
const truth: BinarySystem = {
  vaporPressure: [
    { kind: 'antoine', A: 16.1154, B: 3483.67, C: 205.807, log: 'ln', pressureUnit: 'kPa', temperatureUnit: 'C' },
    { kind: 'antoine', A: 16.3872, B: 3885.7, C: 230.17, log: 'ln', pressureUnit: 'kPa', temperatureUnit: 'C' },
  ],
  activity: { kind: 'nrtl', b12: 500.4 * 4.184, b21: 1636.57 * 4.184, alpha, b12T: -8, b21T: 12 },
}
const dataSet = (P: number, seed: number): BinaryPoint[] =>
  Array.from({ length: 30 }, (_, i) => {
    const x1 = 0.02 + (0.96 * i) / 29
    const b = bubbleTemperature(truth, { P, x1 })
    return { T: b.T + 0.1 * Math.sin(3.7 * i + seed), P, x1, y1: b.y1 + 0.005 * Math.cos(2.3 * i + seed) }
  })
const sets = [
  { id: 'A', points: dataSet(40000, 1) },
  { id: 'B', points: dataSet(101325, 2) },
  { id: 'C', points: dataSet(250000, 3) },
]
const run = () => fitJoint({ dataSets: sets, vaporPressure: truth.vaporPressure, model: 'nrtl', alpha })

// Warm up until V8 has compiled the hot paths (a steady state, as a server or a page that fits repeatedly sees).
for (let i = 0; i < 200; i++) run()
const wall: number[] = []
const cpu: number[] = []
for (let i = 0; i < 101; i++) {
  const c0 = process.cpuUsage()
  const t0 = performance.now()
  run()
  wall.push(performance.now() - t0)
  const c = process.cpuUsage(c0)
  cpu.push((c.user + c.system) / 1000)
}
const median = (v: number[]) => [...v].sort((a, b) => a - b)[Math.floor(v.length / 2)]
const ours = { wall: median(wall), cpu: median(cpu) }
const fit = run()
console.log('\nJoint fit benchmark (NRTL, b and bT for both energies, 3 × 30 points)')
console.log(
  `  Ebullio fitJoint (multi-start): ${ours.wall.toFixed(2)} ms wall median, ${ours.cpu.toFixed(2)} ms CPU; target < 20 ms ${ours.wall < 20 ? 'met' : 'MISSED'}`,
)
const points = sets.flatMap((s) => s.points)
const input = JSON.stringify({
  points: points.map((p) => ({ T: p.T, lnP: Math.log(p.P), x1: p.x1, y1: p.y1 })),
  vp: truth.vaporPressure.map(compileVaporPressure).map((v) => [v.a, v.b, v.c]),
  alpha,
  sigmaT: 0.1,
  sigmaY: 0.005,
  start: [0, 0, 0, 0],
  repeats: 7,
})
const script = fileURLToPath(new URL('./scipy-fit.py', import.meta.url))
const sp = spawnSync('python3', [script], { input, encoding: 'utf8' })
if (sp.status !== 0) {
  console.log(`  scipy comparison skipped: ${(sp.stderr || String(sp.error)).split('\n')[0]}`)
} else {
  const r = JSON.parse(sp.stdout) as { medianMs: number; cpuMs: number; params: number[]; cost: number; nfev: number }
  const mine = fit.parameters.map((p) => p.value)
  const same =
    r.params.every((v, j) => Math.abs(v - mine[j]) <= 1e-4 * Math.max(1, Math.abs(mine[j]))) &&
    Math.abs(r.cost - fit.objective) <= 1e-6 * fit.objective
  console.log(
    `  scipy least_squares (MINPACK lm, one start at 0): ${r.medianMs.toFixed(1)} ms wall median, ${r.cpuMs.toFixed(1)} ms CPU, ${r.nfev} evaluations`,
  )
  console.log(
    `  ratio ${(r.medianMs / ours.wall).toFixed(1)}× by wall clock, ${(r.cpuMs / ours.cpu).toFixed(1)}× by CPU (target ≥ 20×); same optimum: ${same ? 'yes' : 'NO'}`,
  )
  console.log(`    Ebullio ${mine.map((v) => v.toFixed(4)).join(', ')}; objective ${fit.objective.toFixed(6)}`)
  console.log(`    scipy   ${r.params.map((v) => v.toFixed(4)).join(', ')}; objective ${r.cost.toFixed(6)}`)
}
