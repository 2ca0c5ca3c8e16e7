/** Building blocks of the report's pages: colours, section headings, key–value lists, tables, the signature manifest. */
import type { Content, TableCell } from 'pdfmake/interfaces'
import type { ReportModel } from './report-model.js'
import { dateTime, groupedDigest } from './report-text.js'

/** Ebullio's ink and accents (the web app's palette). */
export const C = {
  ink: '#221f1b',
  muted: '#635e53',
  line: '#d6d2c8',
  band: '#efece6',
  paper: '#ffffff',
  teal: '#1a545c',
  amber: '#c98a12',
  amberSoft: '#fbf1dc',
  danger: '#a3321f',
  ok: '#2f6b3a',
}

/** "3  Fits compared": a numbered section heading with a rule under it. */
export function heading(n: string, title: string, pageBreak = false): Content {
  return {
    margin: [0, 12, 0, 5],
    pageBreak: pageBreak ? 'before' : undefined,
    stack: [
      {
        text: [
          { text: `${n}  `, color: C.amber, bold: true },
          { text: title, bold: true },
        ],
        fontSize: 12,
      },
      { canvas: [{ type: 'line', x1: 0, y1: 2, x2: 499, y2: 2, lineWidth: 0.6, lineColor: C.teal }] },
    ],
  }
}

export function keyValues(rows: [string, string][]): Content {
  return {
    table: {
      widths: [78, '*'],
      body: rows.map(([k, v]) => [
        { text: k, color: C.muted, fontSize: 8 },
        { text: v, fontSize: 8.5 },
      ]),
    },
    layout: 'noBorders',
  }
}

/** A table with a shaded header row that repeats on every page. */
export function grid(header: string[], rows: TableCell[][], widths: (string | number)[], fontSize = 8): Content {
  return {
    table: {
      headerRows: 1,
      widths,
      body: [header.map((h) => ({ text: h, style: 'th' })), ...rows],
      dontBreakRows: true,
    },
    layout: {
      hLineWidth: (i: number) => (i <= 1 ? 0.8 : 0.3),
      vLineWidth: () => 0,
      hLineColor: (i: number) => (i <= 1 ? C.teal : C.line),
      paddingTop: () => 2.5,
      paddingBottom: () => 2.5,
    },
    fontSize,
  }
}

export const none = (text: string): Content => ({ text, italics: true, color: C.muted, margin: [0, 0, 0, 4] })

/** Section 7: for each signature the printed name, date and time with time zone, meaning, reason and digest. */
export function signatureSection(m: ReportModel): Content {
  const rows = m.approvals.map((a): TableCell[] => [
    { text: a.signerName, bold: true },
    a.meaning === 'approved'
      ? { text: 'Approved', color: C.ok, bold: true }
      : { text: 'Returned for rework', color: C.danger, bold: true },
    dateTime(a.signedAt, m.report.timeZone),
    {
      stack: [
        a.reason,
        ...(a.selfApproval
          ? [{ text: 'Self-approval permitted by the lab setting (one-person lab).', style: 'small' }]
          : []),
        ...(a.overrideReason ? [{ text: `Open threads overridden: ${a.overrideReason}`, style: 'small' }] : []),
      ],
    },
    {
      stack: [
        { text: groupedDigest(a.digest), fontSize: 6.5 },
        a.digest === m.digest
          ? { text: 'equals the record as printed', color: C.ok, fontSize: 7 }
          : {
              text: 'differs from the record as printed (content changed after this signature)',
              color: C.danger,
              fontSize: 7,
            },
      ],
    },
  ])
  return {
    stack: [
      heading('7', 'Signature manifest'),
      {
        text: 'Each signature was made with the signer’s password entered again; its meaning is what the signer attests. The digest is the SHA-256 of the version’s canonical content at the moment of signing.',
        style: 'small',
        margin: [0, 0, 0, 4],
      },
      rows.length
        ? grid(['Printed name', 'Meaning', 'Date and time', 'Reason', 'Digest signed (SHA-256)'], rows, [
            70,
            58,
            86,
            '*',
            128,
          ])
        : none('No signatures: this version has not been approved or returned.'),
    ],
  }
}
