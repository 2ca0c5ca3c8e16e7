/**
 * Literature data of a system, for drawing beside the lab's own on its plots: every literature data set of the
 * system the user may read (engineers: approved versions only), newest first, with its citation and points.
 * Superseded versions are left out: the newer version of the same series is there.
 */
import type { SessionUser } from '../auth/index.js'
import type { Db } from '../db/index.js'
import { notFound } from '../errors/index.js'
import { listDataSets } from '../repositories/datasets.repository.js'
import { listPoints } from '../repositories/points.repository.js'
import { findSystem } from '../repositories/systems.repository.js'
import { readsEverything } from './lab-access.js'

/** At most this many literature series are sent for one system (the plot's legend stays readable). */
export const LITERATURE_SERIES_MAX = 12

export async function systemLiterature(db: Db, user: SessionUser, systemId: string) {
  if (!(await findSystem(db, systemId))) throw notFound('There is no such binary system.')
  const states = readsEverything(user)
    ? (['draft', 'submitted', 'returned', 'approved'] as const)
    : (['approved'] as const)
  const { items, total } = await listDataSets(db, {
    systemId,
    origin: 'literature',
    states: [...states],
    sort: 'updated_at',
    order: 'desc',
    limit: LITERATURE_SERIES_MAX,
    offset: 0,
  })
  const series = await Promise.all(
    items.map(async (d) => ({
      dataSetId: d.id,
      title: d.title,
      version: d.version,
      state: d.state,
      layout: d.layout,
      nominalPressurePa: d.nominalPressurePa,
      citation: d.citation,
      points: (await listPoints(db, d.id)).map((p) => ({
        id: p.id,
        sampleLabel: p.sampleLabel,
        temperatureK: p.temperatureK,
        pressurePa: p.pressurePa,
        x1: p.x1,
        y1: p.y1,
        excluded: p.excluded,
      })),
    })),
  )
  return { systemId, items: series, total }
}
