import { sql } from 'kysely'
import type { DataSetState } from '../db/lab-tables.js'
import type { Db } from '../db/index.js'

/** What decides a data set's curve, read in one query: who may see it, which fit, which vapour-pressure sets. */
export interface CurveSource {
  state: DataSetState
  /** The fit asked for, else the recommended one; null when there is none. */
  fitId: string | null
  fitDataSetId: string | null
  componentNames: [string, string]
  /** The vapour-pressure set each component's curve is computed with (preferred, else newest), or null. */
  vaporPressureSetIds: [string | null, string | null]
}

export async function findCurveSource(db: Db, dataSetId: string, fitId?: string): Promise<CurveSource | undefined> {
  const set = (component: 's.component1_id' | 's.component2_id') =>
    sql<string | null>`(select v.id from vapor_pressure_set v where v.component_id = ${sql.ref(component)}
      order by v.preferred desc, v.created_at desc limit 1)`
  const row = await db
    .selectFrom('data_set as d')
    .innerJoin('binary_system as s', 's.id', 'd.system_id')
    .innerJoin('component as c1', 'c1.id', 's.component1_id')
    .innerJoin('component as c2', 'c2.id', 's.component2_id')
    .leftJoin('fit as f', (j) => (fitId ? j.on('f.id', '=', fitId) : j.onRef('f.id', '=', 'd.recommended_fit_id')))
    .select([
      'd.state',
      'f.id as fit_id',
      'f.data_set_id as fit_data_set_id',
      'c1.name as name1',
      'c2.name as name2',
      set('s.component1_id').as('vp1'),
      set('s.component2_id').as('vp2'),
    ])
    .where('d.id', '=', dataSetId)
    .executeTakeFirst()
  return (
    row && {
      state: row.state,
      fitId: row.fit_id,
      fitDataSetId: row.fit_data_set_id,
      componentNames: [row.name1, row.name2],
      vaporPressureSetIds: [row.vp1, row.vp2],
    }
  )
}
