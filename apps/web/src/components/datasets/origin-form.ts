import { citationSchema, type Citation, type DataLayout, type DataOrigin } from '@ebullio/schemas'

/** The origin part of the new-data-set form as typed (citation fields as text, the year as text too). */
export interface OriginForm {
  origin: DataOrigin
  originMethod: string
  layout: DataLayout
  citation: {
    authors: string
    title: string
    source: string
    year: string
    volume: string
    pages: string
    doi: string
    table: string
  }
}

export const ORIGIN_CHOICES: { value: DataOrigin; label: string; help: string }[] = [
  { value: 'gc', label: 'Measured here, analysed by GC', help: 'You upload the calibration and run files next.' },
  {
    value: 'other-method',
    label: 'Measured here by another method',
    help: 'Compositions from another analysis (refractive index, density …); you enter the points next.',
  },
  {
    value: 'literature',
    label: 'Literature data',
    help: 'Published points for comparison; give the full citation. It counts as the lab’s own measurement only if a lead chemist marks it so.',
  },
]

export const LAYOUT_CHOICES: { value: DataLayout; label: string }[] = [
  { value: 'txy', label: 'T–x–y at constant pressure' },
  { value: 'pxy', label: 'P–x–y at constant temperature' },
  { value: 'tx', label: 'T–x at constant pressure (no vapour analysed)' },
  { value: 'px', label: 'P–x at constant temperature (no vapour analysed)' },
]

/** Isothermal layouts carry a temperature instead of a nominal pressure. */
export const isIsothermal = (layout: DataLayout) => layout === 'pxy' || layout === 'px'

export function emptyOrigin(): OriginForm {
  return {
    origin: 'gc',
    originMethod: '',
    layout: 'txy',
    citation: { authors: '', title: '', source: '', year: '', volume: '', pages: '', doi: '', table: '' },
  }
}

/** Check the origin fields with the API's own schema; answers the values to send, or the messages per field. */
export function checkOriginForm(f: OriginForm):
  | {
      ok: true
      value: { origin: DataOrigin; originMethod: string | null; citation: Citation | null; layout: DataLayout }
    }
  | { ok: false; errors: Record<string, string> } {
  const errors: Record<string, string> = {}
  let citation: Citation | null = null
  if (f.origin === 'literature') {
    const c = f.citation
    const r = citationSchema.safeParse({ ...c, year: c.year.trim() === '' ? undefined : Number(c.year) })
    if (r.success) citation = r.data
    else
      for (const i of r.error.issues)
        errors[`citation.${String(i.path[0])}`] ??=
          i.path[0] === 'year' && !c.year.trim() ? 'Enter the year' : i.message
  }
  if (f.origin === 'other-method' && !f.originMethod.trim())
    errors.originMethod = 'Say how the compositions were measured (the method other than GC).'
  if (Object.keys(errors).length) return { ok: false, errors }
  return {
    ok: true,
    value: {
      origin: f.origin,
      originMethod: f.origin === 'other-method' ? f.originMethod.trim() : null,
      citation,
      layout: f.layout,
    },
  }
}

/** "A. Author, B. Author (1987). Title. Journal 12, 101–109. doi:… (Table 2)" */
export function citationText(c: Citation | null): string {
  if (!c) return ''
  const vol = [c.volume, c.pages].filter(Boolean).join(', ')
  return [
    `${c.authors} (${c.year}). ${c.title}. ${c.source}${vol ? ' ' + vol : ''}.`,
    c.doi ? `doi:${c.doi}` : '',
    c.table ? `(${c.table})` : '',
  ]
    .filter(Boolean)
    .join(' ')
}

export const ORIGIN_LABEL: Record<DataOrigin, string> = {
  gc: 'measured here by GC',
  'other-method': 'measured here by another method',
  literature: 'literature',
}
