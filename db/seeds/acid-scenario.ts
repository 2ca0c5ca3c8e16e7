/**
 * The demo's dimerising vapour: a small draft series of acetic acid (1) + water (2) at 1 atm under a
 * Hayden–O'Connell virial vapour, where the engine runs the chemical theory of dimerisation (acetic acid's η = 4.5).
 * THE MEASUREMENTS ARE INVENTED: bubble temperatures and vapour compositions of an INVENTED NRTL model (b12 = 1800,
 * b21 = 700 J/mol, α = 0.3; not a published parameter set) solved by @ebullio/thermo's γ–φ bubble point under that
 * vapour, plus seeded noise (0.05 K, 0.003 in y), typed in as points (another method). The analyst has fitted NRTL and
 * run the consistency tests; the series stays a draft (nothing about it is signed).
 *
 * Published constants, with their sources: acetic acid's Tc 591.95 K, Pc 5.786 MPa, ω 0.467, Vc 177.6 cm³/mol and
 * dipole 1.74 D (common handbook values, from memory); its HOC mean radius of gyration 2.595 Å and η 4.5 (Hayden &
 * O'Connell 1975 tables as reproduced in Prausnitz et al. 1980, from memory); its Antoine set log10(P/mmHg) =
 * 7.38782 − 1533.313/(t/°C + 222.309) (Lange's Handbook of Chemistry, Antoine table, from memory); liquid molar volume
 * 57.5 cm³/mol (60.05 g/mol over 1.045 g/cm³ at 25 °C, from memory). Water is the demo's (demo-systems.ts,
 * demo-properties.ts). The same values are in apps/api/test/lab-acid-vapour.test.ts and the engine's
 * chemical-theory tests.
 *
 * Idempotent: the component, the system and the data set are each created only when missing.
 */
import { bubbleTemperature, type VaporPressureModel } from '@ebullio/thermo'
import { seededRandom } from '@ebullio/thermo/random'
import {
  findComponentByName,
  insertComponent,
  insertVaporPressureSet,
} from '../../apps/api/src/repositories/components.repository.js'
import { findSystemByPair, insertSystem } from '../../apps/api/src/repositories/systems.repository.js'
import * as datasets from '../../apps/api/src/services/datasets.service.js'
import { addTypedPoints } from '../../apps/api/src/services/direct-points.service.js'
import * as fits from '../../apps/api/src/services/fits.service.js'
import { engineVapor, getSystem } from '../../apps/api/src/services/systems.service.js'
import { demoVaporPressure } from './demo-systems.js'
import type { SeedContext } from './lab.js'

export const ACID_TITLE = 'Vent condensate trial, dimerising vapour: acetic acid + water at 1 atm'

const HOC_SOURCE =
  "RD and η: Hayden & O'Connell, Ind. Eng. Chem. Process Des. Dev. 14 (1975) 209, tables as reproduced in Prausnitz et al. (1980) (from memory)"

export const ACETIC_ACID = {
  name: 'acetic acid',
  casNumber: '64-19-7',
  formula: 'C2H4O2',
  molarMass: 60.052,
  liquidMolarVolume: 57.5,
  properties: {
    Tc: 591.95,
    Pc: 5.786e6,
    omega: 0.467,
    Vc: 177.6,
    dipole: 1.74,
    radiusOfGyration: 2.595,
    associationEta: 4.5,
    associationSource: HOC_SOURCE,
    source: 'Tc, Pc, ω, Vc, dipole: common handbook values (from memory)',
  },
}

export const ACETIC_ACID_ANTOINE: VaporPressureModel = {
  kind: 'antoine',
  A: 7.38782,
  B: 1533.313,
  C: 222.309,
  log: 'log10',
  pressureUnit: 'mmHg',
  temperatureUnit: 'C',
}

/** The invented activity model the points come from (no published system). */
const INVENTED_NRTL = { kind: 'nrtl' as const, b12: 1800, b21: 700, alpha: 0.3 }

async function aceticAcid(ctx: SeedContext): Promise<string> {
  const existing = await findComponentByName(ctx.db, ACETIC_ACID.name)
  if (existing) return existing.id
  const row = await insertComponent(ctx.db, ACETIC_ACID, ctx.users.admin.id)
  await insertVaporPressureSet(ctx.db, {
    componentId: row.id,
    kind: 'antoine',
    parameters: ACETIC_ACID_ANTOINE as never,
    rangeMin: null,
    rangeMax: null,
    rangeUnit: null,
    source: "Lange's Handbook of Chemistry, Antoine table (from memory)",
    preferred: true,
    enteredBy: ctx.users.admin.id,
  })
  return row.id
}

/** Acetic acid, the acetic acid/water system and the draft series (each only when missing). */
export async function acidScenario(ctx: SeedContext): Promise<void> {
  const { db, users } = ctx
  const acid = await aceticAcid(ctx)
  const water = await findComponentByName(db, 'water')
  if (!water) return
  const sys =
    (await findSystemByPair(db, acid, water.id)) ??
    (await insertSystem(db, {
      component1Id: acid,
      component2Id: water.id,
      notes:
        'Acetic acid dimerises in the vapour: use a Hayden–O’Connell vapour (the chemical theory of dimerisation runs). Demo model: invented NRTL parameters.',
      createdBy: users.analyst.id,
    }))
  if (await db.selectFrom('data_set').select('id').where('title', '=', ACID_TITLE).executeTakeFirst()) return
  const choice = { kind: 'virial' as const, correlation: 'hayden-oconnell' as const, poynting: false }
  const vapor = engineVapor(await getSystem(db, sys.id), choice)
  const model = {
    vaporPressure: [ACETIC_ACID_ANTOINE, demoVaporPressure('water')] as [VaporPressureModel, VaporPressureModel],
    activity: INVENTED_NRTL,
    vapor,
  }
  const rand = seededRandom(4517)
  const points = [0.05, 0.15, 0.3, 0.45, 0.6, 0.75, 0.9].map((x1, i) => {
    const b = bubbleTemperature(model, { P: 101325, x1 })
    return {
      sampleLabel: `VC-${String(i + 1).padStart(2, '0')}`,
      temperatureK: Math.round((b.T + 0.05 * rand.gaussian()) * 100) / 100,
      pressurePa: 101325,
      x1,
      y1: Math.round(Math.min(1, Math.max(0, b.y1 + 0.003 * rand.gaussian())) * 1e4) / 1e4,
      x1Uncertainty: 0.002,
      y1Uncertainty: 0.003,
      pressureUncertaintyPa: null,
    }
  })
  const d = await datasets.createDataSet(db, users.analyst.id, {
    systemId: sys.id,
    title: ACID_TITLE,
    nominalPressurePa: 101325,
    vaporModel: choice,
    apparatusNotes: 'Recirculating still no. 2; acid in liquid and condensate by titration, water by difference.',
    projectRef: 'SR-24',
    origin: 'other-method',
    originMethod: 'Recirculating still; liquid and condensed vapour titrated with sodium hydroxide',
  })
  await addTypedPoints(db, users.analyst, d.id, { rowVersion: d.rowVersion, points })
  await fits.runFits(db, users.analyst, d.id, { models: ['nrtl'] })
  await fits.runConsistency(db, users.analyst, d.id, 'nrtl')
}
