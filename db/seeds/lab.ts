/**
 * The demo scenario of the lab. ALL MEASUREMENTS HERE ARE INVENTED for the demo: the fictional
 * "Halvorsen Fine Chemicals, Solvent Recovery Laboratory" recovers process solvents for its plant
 * (projects "SR-24 mother-liquor recovery" and "Kestrel acetone recycle", both invented). The points are
 * generated from published model parameters (see demo-systems.ts) plus simulated GC noise, written as raw
 * GC files and loaded through the same upload code as a real file.
 *
 * Idempotent: every step first looks for what it would create and skips it when present, so a second
 * `npm start` neither duplicates nor wipes anything.
 */
import { DEMO_PROPERTIES } from './demo-properties.js'
import type { Kysely } from 'kysely'
import type { SessionUser } from '../../apps/api/src/auth/index.js'
import { loadConfig, type Config } from '../../apps/api/src/config.js'
import type { Database } from '../../apps/api/src/db/index.js'
import {
  findComponentByName,
  insertComponent,
  insertVaporPressureSet,
} from '../../apps/api/src/repositories/components.repository.js'
import { findGcMethodByName, listCalibrations } from '../../apps/api/src/repositories/calibrations.repository.js'
import { findSystemByPair, insertSystem } from '../../apps/api/src/repositories/systems.repository.js'
import { commitCalibration, createGcMethod } from '../../apps/api/src/services/calibrations.service.js'
import { scenarioDataSets } from './lab-scenario.js'
import { vapourAndIsothermalDataSets } from './lab-scenario-vapour.js'
import { DEMO_COMPONENTS, DEMO_SYSTEMS, demoVaporPressure } from './demo-systems.js'
import { calibrationCsv } from './gc-generator.js'
import { jointScenario } from './joint-scenario.js'
import { mixedJointScenario } from './joint-mixed-scenario.js'
import { acidScenario } from './acid-scenario.js'
import { DEMO_USERS } from './users.js'

export interface SeedContext {
  db: Kysely<Database>
  config: Config
  users: Record<'analyst' | 'lead' | 'lead2' | 'reviewer' | 'engineer' | 'admin', SessionUser>
  systemIds: Record<string, string>
}

const GC_METHODS = {
  FID: {
    name: 'FID-A, wax capillary',
    detector: 'FID' as const,
    columnDescription: 'polyethylene glycol capillary, 30 m × 0.32 mm',
    conditions: '60 °C 3 min, 10 K/min to 160 °C; split 50:1',
  },
  TCD: {
    name: 'TCD-B, porous polymer',
    detector: 'TCD' as const,
    columnDescription: 'porous polymer packed, 2 m',
    conditions: '150 °C isothermal; helium 30 mL/min',
  },
}

function sessionUsers(ids: Record<string, string>): SeedContext['users'] {
  const by = (email: string): SessionUser => {
    const u = DEMO_USERS.find((d) => d.email === email)!
    return { id: ids[email], email, displayName: u.displayName, roles: [...u.roles] }
  }
  return {
    analyst: by('analyst@demo.ebullio.test'),
    lead: by('lead@demo.ebullio.test'),
    lead2: by('lead2@demo.ebullio.test'),
    reviewer: by('reviewer@demo.ebullio.test'),
    engineer: by('engineer@demo.ebullio.test'),
    admin: by('admin@demo.ebullio.test'),
  }
}

async function seedComponents(db: Kysely<Database>, adminId: string): Promise<Record<string, string>> {
  const ids: Record<string, string> = {}
  for (const c of Object.values(DEMO_COMPONENTS)) {
    const existing = await findComponentByName(db, c.name)
    if (existing) {
      ids[c.name] = existing.id
      continue
    }
    const row = await insertComponent(
      db,
      {
        name: c.name,
        casNumber: c.cas,
        formula: c.formula,
        molarMass: c.molarMass,
        liquidMolarVolume: c.molarVolume,
        properties: DEMO_PROPERTIES[c.cas] ?? null,
      },
      adminId,
    )
    const m = demoVaporPressure(c.name)
    await insertVaporPressureSet(db, {
      componentId: row.id,
      kind: 'antoine',
      parameters: m as never,
      rangeMin: c.antoine.range[0],
      rangeMax: c.antoine.range[1],
      rangeUnit: 'C',
      source: c.source,
      preferred: true,
      enteredBy: adminId,
    })
    ids[c.name] = row.id
  }
  return ids
}

/** Systems, GC methods and one active calibration per system, from generated calibration sheets. */
async function seedSystemsAndCalibrations(
  ctx: Omit<SeedContext, 'systemIds'>,
  components: Record<string, string>,
): Promise<Record<string, string>> {
  const { db, users } = ctx
  const systemIds: Record<string, string> = {}
  for (const [i, s] of DEMO_SYSTEMS.entries()) {
    const c1 = components[s.light]
    const c2 = components[s.heavy]
    const sys =
      (await findSystemByPair(db, c1, c2)) ??
      (await insertSystem(db, {
        component1Id: c1,
        component2Id: c2,
        notes: `${s.note} Demo model: ${s.modelSource}.`,
        createdBy: users.analyst.id,
      }))
    systemIds[s.key] = sys.id
    const spec = GC_METHODS[s.detector]
    const method = (await findGcMethodByName(db, spec.name)) ?? (await createGcMethod(db, users.analyst.id, spec))
    if ((await listCalibrations(db, { gcMethodId: method.id, systemId: sys.id, status: 'active' })).length > 0) continue
    const content = Buffer.from(calibrationCsv(s, 1000 + i))
    await commitCalibration(
      db,
      users.analyst.id,
      { gcMethodId: method.id, systemId: sys.id, model: 'response-factor' },
      { originalName: `calibration-${s.key}.csv`, contentType: 'text/csv', content },
      true,
    )
  }
  return systemIds
}

/** Load the demo lab: components, systems, calibrations and data sets in every workflow state. */
export async function seedLab(db: Kysely<Database>, ids: Record<string, string>): Promise<void> {
  const kdb = db as Kysely<Database>
  const config = loadConfig({ ...process.env, ALLOW_SELF_APPROVAL: 'false' })
  const users = sessionUsers(ids)
  const components = await seedComponents(kdb, users.admin.id)
  const systemIds = await seedSystemsAndCalibrations({ db: kdb, config, users }, components)
  await scenarioDataSets({ db: kdb, config, users, systemIds })
  await jointScenario({ db: kdb, config, users, systemIds })
  await vapourAndIsothermalDataSets({ db: kdb, config, users, systemIds })
  await mixedJointScenario({ db: kdb, config, users, systemIds })
  // after the others: acetic acid + water under a dimerising (Hayden–O'Connell) vapour, a draft
  await acidScenario({ db: kdb, config, users, systemIds })
}
