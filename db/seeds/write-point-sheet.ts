/**
 * Writes docs/examples/points-acetone-methanol-literature.csv: an INVENTED "literature" table in Ebullio's
 * point-sheet layout — bubble points of the demo's acetone/methanol Wilson model (SVNA 7th ed. Table 12.5
 * parameters, Table B.2 Antoine sets) at 101.325 kPa, computed by @ebullio/thermo and rounded as a table prints them.
 * Run: npx tsx db/seeds/write-point-sheet.ts
 */
import { bubbleTemperature } from '@ebullio/thermo'
import { writeFileSync } from 'node:fs'
import path from 'node:path'
import { fileURLToPath } from 'node:url'
import { DEMO_SYSTEMS, demoVaporPressure } from './demo-systems.js'

const s = DEMO_SYSTEMS.find((d) => d.key === 'acetone-methanol')!
const system = {
  vaporPressure: [demoVaporPressure('acetone'), demoVaporPressure('methanol')] as const,
  activity: s.activity,
}
const lines = ['sample,t,t_unit,p,p_unit,x1,y1,u_x1,u_y1']
;[0.05, 0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 0.95].forEach((x1, i) => {
  const b = bubbleTemperature(
    { vaporPressure: [...system.vaporPressure], activity: system.activity },
    { P: 101325, x1 },
  )
  lines.push(
    `T2-${String(i + 1).padStart(2, '0')},${(b.T - 273.15).toFixed(2)},C,101.325,kPa,${x1.toFixed(3)},${b.y1.toFixed(3)},0.003,0.005`,
  )
})
const out = path.resolve(
  path.dirname(fileURLToPath(import.meta.url)),
  '../../docs/examples/points-acetone-methanol-literature.csv',
)
writeFileSync(out, lines.join('\n') + '\n')
console.log(out)
