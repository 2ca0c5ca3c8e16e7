/**
 * Writes the example files of docs/examples/ from the demo generator (INVENTED DATA, for the demo and
 * the browser tests). Run: `npx tsx db/seeds/write-examples.ts`. Output is deterministic.
 */
import { mkdirSync, writeFileSync } from 'node:fs'
import path from 'node:path'
import { fileURLToPath } from 'node:url'
import { DEMO_SYSTEMS } from './demo-systems.js'
import { calibrationCsv, runCsv } from './gc-generator.js'

const out = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../docs/examples')

/** The run file with three deliberate mistakes an analyst might make, for the preview to flag. */
export function spoilRunCsv(csv: string): string {
  const lines = csv.split('\n')
  // line numbers are 1-based file lines (header = 1)
  lines[5 - 1] = lines[5 - 1].replace(/^([^,]+),vapour,/, '$1,,') // a missing phase
  lines[10 - 1] = lines[10 - 1].replace(/,(\d{3})(\d*\.\d),/, ',$1x$2,') // a non-numeric area
  lines[15 - 1] = lines[15 - 1].replace(/,(\d+\.\d),(\d+\.\d),/, ',-$1,$2,') // a negative area
  return lines.join('\n')
}

/** The same file as an instrument with European settings would write it: BOM, `;`, decimal commas, CRLF. */
export function europeanCsv(csv: string): string {
  const body = csv
    .trimEnd()
    .split('\n')
    .map((l) =>
      l
        .split(',')
        .map((c) => c.replace('.', ','))
        .join(';'),
    )
  return '\uFEFF' + body.join('\r\n') + '\r\n\r\n'
}

function main(): void {
  mkdirSync(out, { recursive: true })
  const system = DEMO_SYSTEMS.find((s) => s.key === 'acetone-methanol')!
  writeFileSync(path.join(out, 'calibration-acetone-methanol.csv'), calibrationCsv(system, 501))
  const run = runCsv(system, { seed: 502, pressurePa: 101325, samples: 12, prefix: 'AM' }).csv
  writeFileSync(path.join(out, 'run-acetone-methanol.csv'), run)
  writeFileSync(path.join(out, 'run-acetone-methanol-with-errors.csv'), spoilRunCsv(run))
  writeFileSync(path.join(out, 'run-acetone-methanol-semicolon.csv'), europeanCsv(run))
  // A partially miscible pair: samples that boil as two liquid layers carry layers = 2 and both layers.
  const wb = DEMO_SYSTEMS.find((s) => s.key === 'water-1-butanol')!
  writeFileSync(path.join(out, 'calibration-water-1-butanol.csv'), calibrationCsv(wb, 511))
  const wbRun = runCsv(wb, { seed: 512, pressurePa: 101325, samples: 12, prefix: 'WB' }).csv
  writeFileSync(path.join(out, 'run-water-1-butanol-two-layers.csv'), wbRun)
  console.log(`Example files written to ${out}`)
}

if (process.argv[1] && fileURLToPath(import.meta.url) === path.resolve(process.argv[1])) main()
