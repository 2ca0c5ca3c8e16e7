/** Sections 1–4 and 6 of the report: method, points, fits, consistency, comments. */
import { fitLabel } from '@ebullio/schemas'
import type { Content, TableCell } from 'pdfmake/interfaces'
import { computedOn } from '../point-set.js'
import type { ReportModel } from './report-model.js'
import { C, grid, heading, keyValues, none } from './report-blocks.js'
import { systemSetBlock } from './report-system-set.js'
import { engineVaporLabel, layoutLabel, objectiveLabel, vaporModelLabel } from '@ebullio/schemas'
import {
  calibrationModelName,
  conditionText,
  dateTime,
  modelName,
  num,
  originText,
  PARAMETER_UNITS,
  sig,
} from './report-text.js'

export function methodSection(m: ReportModel): Content {
  const c = (x: ReportModel['system']['component1'], i: number): [string, string] => [
    `Component ${i}`,
    `${x.name}${x.cas ? `, CAS ${x.cas}` : ''}${x.formula ? `, ${x.formula}` : ''}${i === 1 ? ' (the lighter)' : ''}`,
  ]
  return {
    stack: [
      heading('1', 'System, still and method'),
      keyValues([
        c(m.system.component1, 1),
        c(m.system.component2, 2),
        ['Kind of data', `${layoutLabel(m.dataSet.layout)}, ${conditionText(m.dataSet)}`],
        ['Vapour model', vaporModelLabel(m.dataSet.vaporModel)],
        ['Origin of the numbers', originText(m.dataSet)],
        ['Still and apparatus', m.dataSet.apparatusNotes ?? 'not recorded'],
        ...m.vaporPressure.map((v): [string, string] => [`Vapour pressure`, `${v.component}: ${v.kind}, ${v.source}`]),
      ]),
      { text: 'GC methods and calibrations behind the points', bold: true, margin: [0, 6, 0, 2] },
      m.gcMethods.length
        ? grid(
            ['GC method', 'Detector', 'Column', 'Conditions', 'Status'],
            m.gcMethods.map((g) => [g.name, g.detector, g.columnDescription ?? '–', g.conditions ?? '–', g.status]),
            [90, 40, '*', '*', 40],
          )
        : none('No GC method: these points did not come through a calibrated GC run.'),
      ...(m.calibrations.length
        ? [
            {
              margin: [0, 4, 0, 0],
              stack: [
                grid(
                  ['Calibration record', 'Model and coefficients (± standard error)', 'Range x₁', 'Status'],
                  m.calibrations.map((k) => [
                    {
                      stack: [
                        k.originalName,
                        { text: `${k.gcMethodName}, ${dateTime(k.createdAt, m.report.timeZone)}`, style: 'small' },
                        { text: `file SHA-256 ${k.sha256.slice(0, 16)}…`, style: 'small' },
                      ],
                    },
                    {
                      stack: [
                        calibrationModelName(k.model),
                        k.coefficientNames
                          .map((n, i) => `${n} = ${sig(k.coefficients[i], 6)} ± ${sig(k.standardErrors[i], 2)}`)
                          .join(', '),
                      ],
                    },
                    `${num(k.rangeMin, 3)}–${num(k.rangeMax, 3)}`,
                    k.status,
                  ]),
                  [150, '*', 60, 40],
                ),
              ],
            } as Content,
          ]
        : []),
    ],
  }
}

export function pointsSection(m: ReportModel): Content {
  const flagged = new Set(m.outlierIds)
  const rows = m.points.map((p): TableCell[] => {
    const sigmaP = p.pressureUncertaintyPa ? `σP = ${sig(p.pressureUncertaintyPa / 1000, 2)} kPa` : ''
    const flag = p.excluded
      ? `excluded: ${p.exclusionReason ?? ''}`
      : flagged.has(p.id)
        ? 'outlier flag (as signed)'
        : ''
    const note = [flag, sigmaP].filter(Boolean).join('; ')
    const cell = (t: string) => ({ text: t, alignment: 'right' as const, color: p.excluded ? C.muted : C.ink })
    return [
      cell(String(p.seq)),
      { text: p.sampleLabel, color: p.excluded ? C.muted : C.ink },
      cell(num(p.temperatureK, 2)),
      cell(num(p.temperatureK - 273.15, 2)),
      cell(num(p.pressurePa / 1000, 3)),
      cell(num(p.x1, 4)),
      cell(num(p.x1Uncertainty, 4)),
      cell(num(p.y1, 4)),
      cell(num(p.y1Uncertainty, 4)),
      { text: note, fontSize: 7, color: p.excluded ? C.danger : C.amber },
    ]
  })
  const n = m.points.filter((p) => !p.excluded).length
  return {
    stack: [
      heading('2', 'Measured points'),
      {
        text: `${m.points.length} points, ${n} included. u = standard uncertainty of the mole fraction (from the calibration and replicate injections); component 1 is ${m.system.component1.name}.`,
        style: 'small',
        margin: [0, 0, 0, 4],
      },
      m.points.length
        ? grid(['#', 'Sample', 'T / K', 'T / °C', 'P / kPa', 'x₁', 'u(x₁)', 'y₁', 'u(y₁)', 'Note'], rows, [
            16,
            54,
            38,
            34,
            40,
            36,
            34,
            36,
            34,
            '*',
          ])
        : none('No points yet.'),
    ],
  }
}

/** "STALE" and what the result was computed on, under its name (services/point-set.ts `computedOn`). */
function staleMark(r: { pointCount: number | null; runAt: Date }): Content[] {
  return [
    { text: 'STALE', color: C.danger, bold: true, fontSize: 7 },
    { text: `${computedOn(r)}; not the points listed here`, fontSize: 6.5, color: C.muted },
  ]
}

export function fitsSection(m: ReportModel): Content {
  const rec = m.dataSet.recommendedFitId
  const ordered = [...m.fits].sort((a, b) => Number(b.id === rec) - Number(a.id === rec))
  const rows = ordered.map((f): TableCell[] => {
    const isRec = f.id === rec
    const fill = isRec ? C.amberSoft : undefined
    // a stale fit is printed in grey with what it was computed on, never as a result of these points
    const ink = f.stale ? C.muted : C.ink
    const s = f.statistics as { rmsT?: number; rmsP?: number; rmsY?: number; aic?: number; converged?: boolean }
    const o = f.options as {
      objective?: string
      vapor?: { kind: 'ideal' } | { kind: 'virial'; correlation?: string; poynting?: boolean; eta12?: number }
    }
    const onPressure = o.objective === 'bubble-pressure'
    const held =
      f.model === 'nrtl' && typeof f.options.alpha === 'number' && !f.parameters.some((p) => p.name === 'alpha')
    const params = [
      ...f.parameters.map((p) => {
        const se = p.atBound ? ' (at bound, held)' : p.standardError === null ? '' : ` ± ${sig(p.standardError, 3)}`
        const unit = PARAMETER_UNITS[p.name] ? ` ${PARAMETER_UNITS[p.name]}` : ''
        return `${p.name === 'alpha' ? 'α' : p.name} = ${sig(p.value, 6)}${se}${unit}`
      }),
      ...(held ? [`α = ${f.options.alpha} held`] : []),
      // UNIQUAC's r and q, taken from the components (not fitted)
      ...(f.model === 'uniquac'
        ? [
            (['r1', 'r2', 'q1', 'q2'] as const)
              .map((k) => `${k} = ${sig((f.activity as Record<string, number>)[k], 4)}`)
              .join(', ') + ' (components)',
          ]
        : []),
    ]
    return [
      {
        fillColor: fill,
        stack: [
          { text: fitLabel(f, m.fits), bold: true, color: ink },
          ...(isRec ? [{ text: 'RECOMMENDED', color: C.amber, bold: true, fontSize: 7 }] : []),
          ...(f.stale ? staleMark(f) : []),
        ],
      },
      {
        fillColor: fill,
        stack: [
          { text: params.join('\n'), color: ink },
          {
            text: `Objective: ${objectiveLabel(o.objective)}. Vapour: ${engineVaporLabel(o.vapor)}.`,
            fontSize: 7,
            color: C.muted,
          },
        ],
      },
      {
        text: onPressure ? `${num((s.rmsP ?? NaN) / 1000, 3)} kPa` : `${num(s.rmsT, 3)} K`,
        alignment: 'right',
        fillColor: fill,
        color: ink,
      },
      { text: num(s.rmsY, 4), alignment: 'right', fillColor: fill, color: ink },
      { text: num(s.aic, 1), alignment: 'right', fillColor: fill, color: ink },
      { text: String(f.pointIds.length), alignment: 'right', fillColor: fill, color: ink },
      { text: s.converged === false ? 'no' : 'yes', fillColor: fill, color: s.converged === false ? C.danger : ink },
    ]
  })
  return {
    stack: [
      heading('3', 'Fits compared'),
      {
        text: 'Activity-model fits to the included points; each states its objective and vapour model. The recommended fit, shaded, is the one this version carries; lower AIC is better at equal points.',
        style: 'small',
        margin: [0, 0, 0, 4],
      },
      m.fits.length
        ? grid(
            ['Model', 'Parameters (± standard error)', 'RMS ΔT or ΔP', 'RMS Δy₁', 'AIC', 'Points', 'Converged'],
            rows,
            [62, '*', 46, 44, 34, 30, 40],
          )
        : none('No fits have been run.'),
      { text: m.caution, style: 'small', italics: true, margin: [0, 4, 0, 0] },
      ...systemSetBlock(m),
    ],
  }
}

export function consistencySection(m: ReportModel): Content {
  const rows = m.consistency
    .filter((c) => c.test !== 'quality-score')
    .map((c): TableCell[] => {
      const r = c.result as { D?: number; J?: number; meanAbsDeltaY?: number; model?: string }
      const numbers =
        c.test === 'herington-area'
          ? `D = ${num(r.D, 2)} %, J = ${num(r.J, 2)} %, D − J = ${num((r.D ?? NaN) - (r.J ?? NaN), 2)} %`
          : c.test === 'redlich-kister-area'
            ? `D = ${num(r.D, 2)} %`
            : `mean |Δy₁| = ${num(r.meanAbsDeltaY, 4)}${r.model ? ` (${modelName(r.model)})` : ''}`
      const criterion =
        c.test === 'herington-area'
          ? 'passes when D − J < 10 %'
          : c.test === 'redlich-kister-area'
            ? 'passes when D < 10 %'
            : 'passes when mean |Δy₁| < 0.01'
      const name =
        c.test === 'herington-area'
          ? 'Area test (Herington)'
          : c.test === 'redlich-kister-area'
            ? 'Area test (Redlich–Kister, isothermal)'
            : 'Point test'
      const ink = c.stale ? C.muted : C.ink
      return [
        {
          stack: [{ text: name, color: ink }, ...(c.stale ? staleMark(c) : [])],
        },
        { text: c.passed ? 'PASSED' : 'FAILED', bold: true, color: c.stale ? C.muted : c.passed ? C.ok : C.danger },
        { text: numbers, color: ink },
        { text: criterion, color: ink },
        { text: dateTime(c.runAt, m.report.timeZone), color: ink },
      ]
    })
  return {
    stack: [
      heading('4', 'Thermodynamic consistency'),
      {
        text: `Computed under the data set's vapour model: ${vaporModelLabel(m.dataSet.vaporModel)}. A result computed under another vapour model or on other points is flagged as stale.`,
        style: 'small',
        margin: [0, 0, 0, 4],
      },
      rows.length
        ? grid(['Test', 'Verdict', 'Result', 'Criterion', 'Run'], rows, [86, 40, '*', 100, 92])
        : none('No consistency tests have been run on this version.'),
      ...(m.points.length && m.points.every((p) => p.y1 === null)
        ? [
            none(
              'The area and point tests need vapour compositions; this data set has none (T–x or P–x), so they cannot run.',
            ),
          ]
        : []),
      ...qualityBlock(m),
    ],
  }
}

/** The data-quality score (latest result): each test's part, the combined figure, the points that cost most. */
function qualityBlock(m: ReportModel): Content[] {
  const latest = m.consistency
    .filter((c) => c.test === 'quality-score')
    .sort((a, b) => b.runAt.getTime() - a.runAt.getTime())[0]
  if (!latest) return []
  const r = latest.result as {
    quality?: number
    tests?: { test: string; applicable: boolean; score: number; value: number; limit: number; source: string }[]
    points?: { pointId?: string; sample?: string; quality: number; gainIfExcluded: number }[]
  }
  const worst = (r.points ?? []).filter((p) => p.gainIfExcluded > 0).slice(0, 5)
  return [
    {
      text: `Data-quality score: ${num(r.quality, 2)} of 1`,
      bold: true,
      color: latest.stale ? C.muted : C.ink,
      margin: [0, 8, 0, 2],
    },
    ...(latest.stale ? staleMark(latest) : []),
    grid(
      ['Test', 'Score (of 0.25)', 'Value', 'Limit', 'Source of the limit'],
      (r.tests ?? []).map((t) => [
        t.test,
        t.applicable ? num(t.score, 3) : 'cannot run',
        t.applicable ? sig(t.value, 3) : '–',
        sig(t.limit, 3),
        { text: t.source, fontSize: 7 },
      ]),
      [70, 50, 50, 40, '*'],
    ),
    {
      text: worst.length
        ? `Points that lower the score most: ${worst.map((p) => `${p.sample ?? '?'} (+${num(p.gainIfExcluded, 3)} without it)`).join(', ')}.`
        : 'No single point lowers the score.',
      style: 'small',
      margin: [0, 2, 0, 0],
    },
  ]
}

export function commentsSection(m: ReportModel): Content {
  const sample = new Map(m.points.map((p) => [p.id, p.sampleLabel]))
  const roots = m.comments.filter((c) => !c.parentId)
  const blocks = roots.map((r): Content => {
    const replies = m.comments.filter((c) => c.parentId === r.id)
    const where = r.pointId ? ` on point ${sample.get(r.pointId) ?? ''}` : ''
    return {
      margin: [0, 0, 0, 5],
      table: {
        widths: [4, '*'],
        body: [
          [
            { text: '', fillColor: r.resolved ? C.ok : C.amber },
            {
              margin: [6, 2, 2, 2],
              stack: [
                {
                  text: [
                    {
                      text: r.resolved ? 'RESOLVED  ' : 'OPEN  ',
                      bold: true,
                      color: r.resolved ? C.ok : C.amber,
                      fontSize: 7,
                    },
                    { text: `${r.authorName}${where}, ${dateTime(r.createdAt, m.report.timeZone)}`, style: 'small' },
                  ],
                },
                { text: r.body },
                ...replies.map((x) => ({
                  margin: [10, 2, 0, 0] as [number, number, number, number],
                  stack: [
                    { text: `${x.authorName}, ${dateTime(x.createdAt, m.report.timeZone)}`, style: 'small' },
                    { text: x.body },
                  ],
                })),
              ],
            },
          ],
        ],
      },
      layout: 'noBorders',
    }
  })
  const open = roots.filter((r) => !r.resolved).length
  return {
    stack: [
      heading('6', 'Comments'),
      roots.length
        ? {
            text: `${roots.length} thread${roots.length === 1 ? '' : 's'}: ${open} open, ${roots.length - open} resolved.`,
            style: 'small',
            margin: [0, 0, 0, 4],
          }
        : none('No comments on this version.'),
      ...blocks,
    ],
  }
}
