/**
 * The block of section 3 that prints the system's signed recommended parameter set: its model and parameters (with
 * the temperature terms and the form they enter in), the vapour model it was fitted under, each contributing data
 * set with its kind and the condition it was measured at, the range of T and P it holds in, who signed it and the
 * digest they signed.
 */
import { memberConditionText, vaporModelLabel } from '@ebullio/schemas'
import type { Content } from 'pdfmake/interfaces'
import type { ReportModel } from './report-model.js'
import { C, grid, keyValues } from './report-blocks.js'
import { dateTime, groupedDigest, num, PARAMETER_UNITS, sig } from './report-text.js'

export function systemSetBlock(m: ReportModel): Content[] {
  const r = m.recommendedSet
  if (!r) return []
  const member = r.dataSets.some((d) => d.dataSetId === m.dataSet.id)
  const params = r.parameters.map((p) => {
    const se = p.standardError === null ? '' : ` ± ${sig(p.standardError, 3)}`
    const unit = PARAMETER_UNITS[p.name] ? ` ${PARAMETER_UNITS[p.name]}` : ''
    return `${p.name === 'alpha' ? 'α' : p.name} = ${sig(p.value, 6)}${se}${unit}`
  })
  const held = Object.entries(r.activity)
    .filter(([k, v]) => typeof v === 'number' && !r.parameters.some((p) => p.name === k))
    .map(([k, v]) => `${k === 'alpha' ? 'α' : k} = ${sig(v as number, 6)} held`)
  return [
    {
      unbreakable: true,
      margin: [0, 10, 0, 0],
      stack: [
        { text: `The system's recommended parameter set: ${r.label}`, bold: true, margin: [0, 0, 0, 2] },
        {
          text: `One parameter set fitted jointly over ${r.dataSets.length} data sets of this system and signed by a lead chemist; engineers use it at any pressure inside its range. ${member ? 'This version is one of the data sets it rests on.' : 'This version is not one of the data sets it rests on.'}`,
          style: 'small',
          margin: [0, 0, 0, 4],
        },
        keyValues([
          ['Parameters', [...params, ...held].join('\n')],
          ...(r.temperatureForm ? [['Temperature form', r.temperatureForm] as [string, string]] : []),
          ['Vapour model', vaporModelLabel(r.vaporModel)],
          [
            'Valid range',
            `T ${num(r.range.Tmin, 2)} to ${num(r.range.Tmax, 2)} K; P ${num(r.range.Pmin / 1000, 3)} to ${num(r.range.Pmax / 1000, 3)} kPa (the fitted points; outside it the set is an extrapolation)`,
          ],
          [
            'Signed',
            r.signedBy
              ? `by ${r.signedBy}${r.approvedAt ? `, ${dateTime(r.approvedAt, m.report.timeZone)}` : ''}`
              : '–',
          ],
          ['Digest signed', r.digest ? groupedDigest(r.digest) : '–'],
        ]),
        grid(
          ['Data set it rests on', 'Version', 'Kind and condition', 'Points'],
          r.dataSets.map((d) => [
            { text: d.title, bold: d.dataSetId === m.dataSet.id },
            { text: String(d.version), alignment: 'right' },
            memberConditionText(d),
            { text: String(d.pointCount), alignment: 'right' },
          ]),
          ['*', 40, 170, 36],
        ),
        { text: r.caution, style: 'small', italics: true, margin: [0, 4, 0, 0], color: C.muted },
      ],
    },
  ]
}
