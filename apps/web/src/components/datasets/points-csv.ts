import type { DataSet, Point } from '../../api/datasets'

/**
 * The points table as CSV in Ebullio's points layout (docs/csv-formats.md, "Points"):
 * `seq,sample,t_k,p_kpa,x1,u_x1,y1,u_y1,excluded,exclusion_reason`, K and kPa whatever the display units.
 */
export function pointsCsv(points: Point[]): string {
  const q = (s: string | null) => (s === null ? '' : /[",\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s)
  const lines = ['seq,sample,t_k,p_kpa,x1,u_x1,y1,u_y1,excluded,exclusion_reason']
  for (const p of points) {
    lines.push(
      [
        p.seq,
        q(p.sampleLabel),
        p.temperatureK.toFixed(3),
        (p.pressurePa / 1000).toFixed(3),
        p.x1.toFixed(5),
        p.x1Uncertainty.toFixed(5),
        p.y1.toFixed(5),
        p.y1Uncertainty.toFixed(5),
        p.excluded ? 'true' : 'false',
        q(p.exclusionReason),
      ].join(','),
    )
  }
  return lines.join('\n') + '\n'
}

/** File name carrying the data set and version, e.g. `points-series-14-v2.csv`. */
export function pointsFileName(d: DataSet): string {
  const stem =
    d.title
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-|-$/g, '')
      .slice(0, 40) || 'data-set'
  return `points-${stem}-v${d.version}.csv`
}
