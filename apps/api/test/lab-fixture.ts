/**
 * A small lab for the workflow tests, built through the API: one user per role (plus a second lead
 * chemist), acetone and methanol with their published Antoine sets, the system, a GC method and a
 * calibration. The GC files come from the demo generator (INVENTED data, published model parameters).
 */
import { readFileSync } from 'node:fs'
import path from 'node:path'
import { fileURLToPath } from 'node:url'
import { sql } from 'kysely'
import { DEMO_COMPONENTS, DEMO_SYSTEMS, demoVaporPressure } from '../../../db/seeds/demo-systems.js'
import { calibrationCsv, runCsv } from '../../../db/seeds/gc-generator.js'
import { createUser, PASSWORD, signedInAgent, type TestContext } from './helpers.js'

export const examples = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../../docs/examples')
export const example = (name: string) => readFileSync(path.join(examples, name))
export const ACETONE_METHANOL = DEMO_SYSTEMS.find((s) => s.key === 'acetone-methanol')!

export type Agent = Awaited<ReturnType<typeof signedInAgent>>

export interface Lab {
  analyst: Agent
  analyst2: Agent
  lead: Agent
  lead2: Agent
  reviewer: Agent
  engineer: Agent
  admin: Agent
  ids: Record<string, string>
  systemId: string
  gcMethodId: string
  calibrationId: string
}

/** Attach a CSV to a multipart request as a browser would. */
export function csv(req: ReturnType<Agent['post']>, content: Buffer | string, name = 'run.csv', type = 'text/csv') {
  return req.attach('file', Buffer.isBuffer(content) ? content : Buffer.from(content), {
    filename: name,
    contentType: type,
  })
}

export async function buildLab(t: TestContext): Promise<Lab> {
  const people: [string, string[], string][] = [
    ['analyst', ['analyst'], 'Mira Analyst'],
    ['analyst2', ['analyst'], 'Ola Analyst'],
    ['lead', ['lead_chemist'], 'Tobias Lead'],
    ['lead2', ['lead_chemist'], 'Rhea Lead'],
    ['reviewer', ['reviewer'], 'Priya Reviewer'],
    ['engineer', ['engineer'], 'Jonas Engineer'],
    ['admin', ['admin'], 'Elena Admin'],
  ]
  const ids: Record<string, string> = {}
  const agents: Record<string, Agent> = {}
  for (const [key, roles, name] of people) {
    ids[key] = await createUser(t.db, { email: `${key}@lab.test`, roles: roles as never, displayName: name })
    agents[key] = await signedInAgent(t.app, `${key}@lab.test`, PASSWORD)
  }
  const componentIds: string[] = []
  for (const name of [ACETONE_METHANOL.light, ACETONE_METHANOL.heavy]) {
    const c = DEMO_COMPONENTS[name]
    const r = await agents.admin.post('/api/components').send({
      name: c.name,
      casNumber: c.cas,
      formula: c.formula,
      molarMass: c.molarMass,
      liquidMolarVolume: c.molarVolume,
    })
    if (r.status !== 201) throw new Error(`component: ${JSON.stringify(r.body)}`)
    await agents.lead
      .post(`/api/components/${r.body.id}/vapor-pressure-sets`)
      .send({ model: demoVaporPressure(name), source: c.source, preferred: true })
      .expect(201)
    componentIds.push(r.body.id)
  }
  const sys = await agents.analyst
    .post('/api/systems')
    .send({ component1Id: componentIds[0], component2Id: componentIds[1] })
    .expect(201)
  const gc = await agents.analyst
    .post('/api/gc-methods')
    .send({
      name: 'FID-PoraBOND',
      detector: 'FID',
      columnDescription: 'porous polymer, 25 m',
      conditions: '120 °C isothermal',
    })
    .expect(201)
  const cal = await csv(
    agents.analyst.post('/api/calibrations'),
    example('calibration-acetone-methanol.csv'),
    'calibration.csv',
  )
    .field('gcMethodId', gc.body.id)
    .field('systemId', sys.body.id)
    .field('model', 'response-factor')
    .field('acceptWarnings', 'true')
  if (cal.status !== 201) throw new Error(`calibration: ${JSON.stringify(cal.body)}`)
  return {
    ...(agents as unknown as Omit<Lab, 'ids' | 'systemId' | 'gcMethodId' | 'calibrationId'>),
    ids,
    systemId: sys.body.id,
    gcMethodId: gc.body.id,
    calibrationId: cal.body.id,
  }
}

/** A draft data set at 1 atm with the example run file committed; returns its id and row version. */
export async function draftWithPoints(
  t: TestContext,
  lab: Lab,
  title = 'Acetone/methanol at 1 atm',
  file: Buffer | string = example('run-acetone-methanol.csv'),
) {
  const d = await lab.analyst
    .post('/api/data-sets')
    .send({
      systemId: lab.systemId,
      title,
      nominalPressurePa: 101325,
      apparatusNotes: 'recirculating still',
      projectRef: 'KES-1',
    })
    .expect(201)
  const c = await csv(lab.analyst.post(`/api/data-sets/${d.body.id}/uploads`), file)
    .field('rowVersion', String(d.body.rowVersion))
    .field('acceptWarnings', 'true')
  if (c.status !== 201) throw new Error(`commit: ${JSON.stringify(c.body)}`)
  return { id: d.body.id as string, rowVersion: c.body.rowVersion as number }
}

/** Another generated run file (invented data) of `samples` points. */
export function generatedRun(samples: number, seed = 77): string {
  return runCsv(ACETONE_METHANOL, { seed, pressurePa: 101325, samples, prefix: 'G' }).csv
}

export { calibrationCsv }

/** Row counts of every lab table, to prove a refused request changed nothing. */
export async function labCounts(t: TestContext): Promise<Record<string, number>> {
  const tables = [
    'upload',
    'calibration',
    'calibration_standard',
    'calibration_injection',
    'data_set',
    'point',
    'point_injection',
    'fit',
    'consistency_result',
    'comment',
    'approval',
    'audit_log',
    'mail_outbox',
    'joint_fit',
    'joint_fit_member',
    'joint_fit_approval',
    'check_standard_result',
  ]
  const out: Record<string, number> = {}
  for (const name of tables) {
    const r = await sql<{ n: number }>`select count(*)::int as n from ${sql.table(name)}`.execute(t.db)
    out[name] = r.rows[0].n
  }
  return out
}
