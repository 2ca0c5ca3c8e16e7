/**
 * Reading upload CSVs (numbers go in bench/README.md, never in tests): the synchronous reader against the sliced
 * one the server uses, on a 19,000-row run file (invented data) and a 5 MB single-line file, with the longest
 * time the event loop was held (the largest gap between two turns of a ticker running beside the read).
 */
import { readCsvTable, readCsvTableAsync } from '../src/uploads/csv-table.js'

const rows = ['sample,phase,injection,area_1,area_2,t_boil,t_unit,p_baro,p_unit']
for (let i = 0; i < 19_000; i++)
  rows.push(`S${i >> 2},${i % 4 < 2 ? 'liquid' : 'vapour'},${(i % 2) + 1},1234.5,5678.9,60.1,C,101.3,kPa`)
const big = rows.join('\n')
const oneLine = rows[0] + ',' + '1.5,'.repeat(1_300_000)

async function measure(name: string, text: string, read: () => unknown | Promise<unknown>) {
  let last = performance.now()
  let worst = 0
  let on = true
  const tick = () => {
    const now = performance.now()
    worst = Math.max(worst, now - last)
    last = now
    if (on) setImmediate(tick)
  }
  setImmediate(tick)
  const t0 = performance.now()
  await read()
  const ms = performance.now() - t0
  on = false
  await new Promise((r) => setImmediate(r))
  console.log(
    `${name.padEnd(44)} ${(text.length / 1024).toFixed(0).padStart(6)} KiB  ${ms.toFixed(0).padStart(5)} ms  longest hold ${worst.toFixed(0)} ms`,
  )
}

for (let run = 1; run <= 3; run++) {
  console.log(`run ${run}`)
  await measure('sync, 19,000 rows', big, () => readCsvTable(big))
  await measure('sliced (server), 19,000 rows', big, () => readCsvTableAsync(big))
  await measure('sync, 5 MB single line', oneLine, () => readCsvTable(oneLine))
  await measure('sliced (server), 5 MB single line', oneLine, () => readCsvTableAsync(oneLine))
}
