/**
 * The report as a PDF (pdfmake on the server, Roboto embedded so Greek letters, subscripts and the true minus
 * sign print). Layout of our own: a lab record with a title block, numbered sections, a signature manifest and
 * a verification panel. Pure: the same model gives the same pages.
 */
import { createRequire } from 'node:module'
import path from 'node:path'
import pdfmake from 'pdfmake'
import type { Content, TDocumentDefinitions } from 'pdfmake/interfaces'
import type { ReportModel } from './report-model.js'
import { residualsSvg, txySvg, xySvg } from './report-plots.js'
import { methodSection, pointsSection, fitsSection, consistencySection, commentsSection } from './report-sections.js'
import {
  conditionText,
  dateTime,
  groupedDigest,
  originText,
  reportNumber,
  stateText,
  watermarkFor,
} from './report-text.js'
import { C, heading, keyValues, signatureSection } from './report-blocks.js'

const require = createRequire(import.meta.url)
const fonts = require('pdfmake/fonts/Roboto.js') as { Roboto: Record<string, string> }
const fontDir = path.dirname(fonts.Roboto.normal)
pdfmake.setFonts(fonts)
// The report embeds nothing from the network and reads only the bundled fonts.
pdfmake.setUrlAccessPolicy(() => false)
pdfmake.setLocalAccessPolicy((p) => path.resolve(p).startsWith(fontDir))

/** Render the report to PDF bytes. */
export async function reportPdf(m: ReportModel): Promise<Buffer> {
  return pdfmake.createPdf(reportDocument(m)).getBuffer()
}

export function reportDocument(m: ReportModel): TDocumentDefinitions {
  const d = m.dataSet
  const mark = watermarkFor(d.state)
  const number = reportNumber(m.report.number)
  return {
    info: {
      title: `${d.title} v${d.version} (${number})`,
      author: m.report.labName,
      subject: 'Vapour–liquid equilibrium record',
      creator: 'Ebullio',
    },
    pageSize: 'A4',
    pageMargins: [48, 60, 48, 56],
    defaultStyle: { font: 'Roboto', fontSize: 9, color: C.ink, lineHeight: 1.15 },
    watermark: mark ? { text: mark, color: C.danger, opacity: 0.12, bold: true, fontSize: 64 } : undefined,
    header: (page) => ({
      margin: [48, 24, 48, 0],
      columns: [
        {
          text: [
            { text: 'EBULLIO', bold: true, color: C.teal },
            { text: '  equilibrium data record', color: C.muted },
          ],
          fontSize: 8,
        },
        {
          text: `${number}  ·  version ${d.version}${mark ? `  ·  ${d.state.toUpperCase()}` : ''}`,
          alignment: 'right',
          fontSize: 8,
          color: page === 1 ? C.paper : C.muted,
        },
      ],
    }),
    footer: (page, pages) => ({
      margin: [48, 16, 48, 0],
      columns: [
        { text: `SHA-256 ${m.digest.slice(0, 16)}…  ·  verify at ${m.report.verifyUrl}`, fontSize: 7, color: C.muted },
        { text: `page ${page} of ${pages}`, alignment: 'right', fontSize: 7, color: C.muted, width: 70 },
      ],
    }),
    content: [
      titleBlock(m, number),
      ...(mark ? [stateNotice(m)] : []),
      ...staleNotice(m),
      methodSection(m),
      pointsSection(m),
      fitsSection(m),
      consistencySection(m),
      plotsSection(m),
      commentsSection(m),
      signatureSection(m),
      verifySection(m, number),
    ],
    styles: {
      small: { fontSize: 7.5, color: C.muted },
      th: { bold: true, fontSize: 8, color: C.ink, fillColor: C.band },
    },
  }
}

/** Said once at the top when a fit or consistency result was computed on other points than the ones listed. */
function staleNotice(m: ReportModel): Content[] {
  const n = m.fits.filter((f) => f.stale).length + m.consistency.filter((c) => c.stale).length
  if (n === 0) return []
  return [
    {
      margin: [0, 0, 0, 8],
      table: {
        widths: ['*'],
        body: [
          [
            {
              text: `${n} result${n === 1 ? ' is' : 's are'} marked STALE: computed on other points than this version has now. They are printed for the record only; a signature never covers them.`,
              color: C.danger,
              bold: true,
              fontSize: 8.5,
              margin: [6, 4, 6, 4],
            },
          ],
        ],
      },
      layout: { hLineColor: () => C.danger, vLineColor: () => C.danger },
    },
  ]
}

function titleBlock(m: ReportModel, number: string): Content {
  const d = m.dataSet
  return {
    table: {
      widths: [6, '*'],
      body: [
        [
          { text: '', fillColor: d.state === 'approved' ? C.teal : C.amber },
          {
            margin: [10, 8, 8, 10],
            stack: [
              { text: m.report.labName, fontSize: 9, color: C.muted },
              { text: d.title, fontSize: 17, bold: true, margin: [0, 2, 0, 2] },
              {
                text: `Vapour–liquid equilibrium of ${m.system.name} ${conditionText(d)}`,
                fontSize: 10,
                color: C.teal,
              },
              {
                margin: [0, 8, 0, 0],
                columns: [
                  keyValues([
                    ['Version', `${d.version} (${d.state})`],
                    ['Project', d.projectRef ?? '–'],
                    ['Origin', d.origin === 'literature' ? 'Literature data (citation in section 1)' : originText(d)],
                    ['Still and apparatus', d.apparatusNotes ?? '–'],
                  ]),
                  keyValues([
                    ['Report', `${number}`],
                    ['Report id', m.report.id],
                    ['Generated', `${dateTime(m.report.generatedAt, m.report.timeZone)} by ${m.report.generatedBy}`],
                  ]),
                ],
                columnGap: 16,
              },
            ],
          },
        ],
      ],
    },
    layout: {
      hLineColor: () => C.line,
      vLineColor: () => C.line,
      paddingLeft: () => 0,
      paddingRight: () => 0,
      paddingTop: () => 0,
      paddingBottom: () => 0,
    },
    margin: [0, 0, 0, 10],
  }
}

function stateNotice(m: ReportModel): Content {
  return {
    table: {
      widths: ['*'],
      body: [
        [
          {
            text: [{ text: 'Not an approved record. ', bold: true }, stateText(m.dataSet.state)],
            color: C.danger,
            margin: [8, 5, 8, 5],
          },
        ],
      ],
    },
    layout: { hLineColor: () => C.danger, vLineColor: () => C.danger },
    margin: [0, 0, 0, 10],
  }
}

function plotsSection(m: ReportModel): Content {
  const residuals = residualsSvg(m)
  return {
    unbreakable: true,
    stack: [
      heading('5', 'Plots'),
      {
        text: `${m.dataSet.nominalTemperatureK !== null ? 'At the nominal temperature' : 'At the nominal pressure'}, ${conditionText(m.dataSet).replace(/^at /, '')}. ${m.curveNote ?? 'Curves: the recommended fit.'}`,
        style: 'small',
        margin: [0, 0, 0, 4],
      },
      {
        columns: [
          { svg: txySvg(m), width: 310 },
          m.points.some((p) => p.y1 !== null) ? { svg: xySvg(m), width: 190 } : { text: '' },
        ],
        columnGap: 8,
      },
      ...(residuals
        ? [
            { text: 'Residuals of the recommended fit', bold: true, margin: [0, 8, 0, 2] } as Content,
            { svg: residuals, width: 500 } as Content,
          ]
        : []),
      { text: m.caution, style: 'small', italics: true, margin: [0, 4, 0, 0] },
    ],
  }
}

function verifySection(m: ReportModel, number: string): Content {
  const approval = [...m.approvals].reverse().find((a) => a.meaning === 'approved')
  return {
    unbreakable: true,
    stack: [
      heading('8', 'Record digest and how to verify it'),
      {
        table: {
          widths: ['*', 96],
          body: [
            [
              {
                margin: [8, 6, 8, 6],
                stack: [
                  {
                    text: 'SHA-256 of the record as printed (canonical signed content of this version)',
                    style: 'small',
                  },
                  {
                    text: groupedDigest(m.digest),
                    fontSize: 10,
                    bold: true,
                    margin: [0, 2, 0, 6],
                    characterSpacing: 0.5,
                  },
                  ...(approval
                    ? [
                        { text: `Digest signed by ${approval.signerName} on approval`, style: 'small' } as Content,
                        { text: groupedDigest(approval.digest), fontSize: 9, margin: [0, 2, 0, 6] } as Content,
                      ]
                    : []),
                  {
                    text: [
                      `To verify ${number}: open `,
                      { text: m.report.verifyUrl, color: C.teal, link: m.report.verifyUrl },
                      ' (or scan the code) and sign in. The page recomputes the digest of the stored record and says whether it still equals the digest printed here and the digests that were signed. A mismatch means the record changed after this report was generated.',
                    ],
                  },
                ],
              },
              { qr: m.report.verifyUrl, fit: 88, margin: [4, 6, 4, 6], foreground: C.ink },
            ],
          ],
        },
        layout: { hLineColor: () => C.teal, vLineColor: () => C.teal },
      },
    ],
  }
}
