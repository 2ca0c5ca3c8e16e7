import { dataSetFileName, pointsCsv } from '@ebullio/schemas/csv-exports'
import type { DataSet } from '../../api/datasets'

/**
 * The points table as CSV: the same layout, decimals and file name as the API's export (docs/csv-formats.md,
 * "Points"), written by the module both share.
 */
export { pointsCsv }

/** File name carrying the data set and version, e.g. `series-14-v2-points.csv` (letters of any script kept). */
export function pointsFileName(d: Pick<DataSet, 'title' | 'version'>): string {
  return dataSetFileName(d, 'points', 'csv')
}
