/**
 * Benchmark of the γ–φ path (`pnpm bench` runs it after bench/run.ts): bubble-temperature solves per CPU-second
 * with a Tsonopoulos virial vapour through the public API, beside the ideal-vapour kernel for scale.
 * Target (issue): ≥ 500,000 γ–φ solves per second on one core.
 * System: 1-propanol–water, NRTL from SVNA 7th ed. Table 12.5 (cal/mol × 4.184), Antoine from Table B.2,
 * critical data from chemicals 1.5.2, 1 atm, 100 compositions 0…1. For scale, a dimerising vapour: acetic acid +
 * water under Hayden–O'Connell with the chemical theory (the system of src/virial/chemical-theory.test.ts: HOC data
 * from memory, NRTL invented); no target.
 */
import { bubbleTemperature, bubbleTemperatureGammaPhi, tsonopoulosPolarParameters } from '../src/index.js'
import type { BinarySystem, VaporModel } from '../src/index.js'
import { res } from '../src/equilibrium/kernel.js'

const system: BinarySystem = {
  vaporPressure: [
    { kind: 'antoine', A: 16.1154, B: 3483.67, C: 205.807, log: 'ln', pressureUnit: 'kPa', temperatureUnit: 'C' },
    { kind: 'antoine', A: 16.3872, B: 3885.7, C: 230.17, log: 'ln', pressureUnit: 'kPa', temperatureUnit: 'C' },
  ],
  activity: { kind: 'nrtl', b12: 500.4 * 4.184, b21: 1636.57 * 4.184, alpha: 0.5081 },
}
const propanol = { Tc: 536.8, Pc: 5169000.0, omega: 0.624, Vc: 218.0, dipole: 1.55 }
const water = { Tc: 647.096, Pc: 22064000.0, omega: 0.3443, Vc: 55.9480372671 }
const vapor: VaporModel = {
  kind: 'virial',
  correlation: 'tsonopoulos',
  components: [
    { ...propanol, tsonopoulos: tsonopoulosPolarParameters({ kind: 'alcohol', ...propanol }) },
    { ...water, tsonopoulos: tsonopoulosPolarParameters({ kind: 'water', ...water }) },
  ],
}

function perCpuSecond(f: (x1: number) => void): { rate: number; iterations: number } {
  for (let i = 0; i < 100_000; i++) f(((i % 100) + 0.5) / 100)
  let n = 0
  let its = 0
  const cpu0 = process.cpuUsage()
  const t0 = performance.now()
  while (performance.now() - t0 < 2000) {
    for (let i = 0; i < 1000; i++) {
      f(((i % 100) + 0.5) / 100)
      its += res[4]
      n++
    }
  }
  const cpu = process.cpuUsage(cpu0)
  return { rate: n / ((cpu.user + cpu.system) / 1e6), iterations: its / n }
}

const fmt = (v: number) => Math.round(v).toLocaleString('en-US')
const ideal = perCpuSecond((x1) => bubbleTemperature(system, { P: 101325, x1 }))
const gp = perCpuSecond((x1) => bubbleTemperatureGammaPhi(system, { P: 101325, x1 }, vapor))
const withVapor: BinarySystem = { ...system, vapor }
const main = perCpuSecond((x1) => bubbleTemperature(withVapor, { P: 101325, x1 }))
const acid: BinarySystem = {
  vaporPressure: [
    { kind: 'antoine', A: 7.38782, B: 1533.313, C: 222.309, log: 'log10', pressureUnit: 'mmHg', temperatureUnit: 'C' },
    system.vaporPressure[1],
  ],
  activity: { kind: 'nrtl', b12: 2000, b21: 1000, alpha: 0.3 },
}
const acidVapor: VaporModel = {
  kind: 'virial',
  correlation: 'hayden-oconnell',
  components: [
    { Tc: 591.95, Pc: 5.786e6, omega: 0.467, Vc: 177.6, RD: 2.595, dipole: 1.74, eta: 4.5 },
    { Tc: 647.096, Pc: 22064000, omega: 0.3443, Vc: 55.948, RD: 0.615, dipole: 1.83, eta: 1.7 },
  ],
  eta12: 2.5,
}
const chem = perCpuSecond((x1) => bubbleTemperatureGammaPhi(acid, { P: 101325, x1 }, acidVapor))
console.log('\nγ–φ benchmark (solves per CPU-second, public API)')
console.log(
  `  bubbleTemperature, ideal vapour, NRTL 1-propanol–water: ${fmt(ideal.rate)} (${ideal.iterations.toFixed(2)} iterations)`,
)
console.log(
  `  bubbleTemperatureGammaPhi, Tsonopoulos vapour: ${fmt(gp.rate)} (${gp.iterations.toFixed(2)} iterations, ideal start included); target ≥ 500,000 ${gp.rate >= 500_000 ? 'met' : 'MISSED'}`,
)
console.log(
  `  bubbleTemperature with system.vapor (Tsonopoulos), the main solver: ${fmt(main.rate)} (${main.iterations.toFixed(2)} iterations)`,
)
console.log(
  `  bubbleTemperatureGammaPhi, acetic acid–water, chemical theory of dimerisation: ${fmt(chem.rate)} (${chem.iterations.toFixed(2)} iterations)`,
)
