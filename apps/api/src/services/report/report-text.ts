/** Words and numbers as the report prints them (pure; unit tests beside). */

const MODEL_NAMES: Record<string, string> = {
  margules: 'Margules',
  'van-laar': 'Van Laar',
  wilson: 'Wilson',
  nrtl: 'NRTL',
  uniquac: 'UNIQUAC',
  ideal: 'Ideal (Raoult)',
}
export const modelName = (m: string) => MODEL_NAMES[m] ?? m

const CALIBRATION_MODELS: Record<string, string> = {
  'response-factor': 'Relative response factor',
  linear: 'Linear in area fraction',
  quadratic: 'Quadratic in area fraction',
}
export const calibrationModelName = (m: string) => CALIBRATION_MODELS[m] ?? m

export const PARAMETER_UNITS: Record<string, string> = {
  a12: 'J/mol',
  a21: 'J/mol',
  b12: 'J/mol',
  b21: 'J/mol',
  // temperature terms of a joint parameter set's energies (about 298.15 K)
  a12T: 'J/(mol·K)',
  a21T: 'J/(mol·K)',
  b12T: 'J/(mol·K)',
  b21T: 'J/(mol·K)',
}

/** A signed number with the true minus sign, no sign on a value that rounds to zero. */
export function num(v: number | null | undefined, decimals: number): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return '–'
  const s = v.toFixed(decimals)
  return /^-0(\.0*)?$/.test(s) ? s.slice(1) : s.replace(/^-/, '−')
}

/** Significant figures, true minus sign. */
export function sig(v: number | null | undefined, digits: number): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return '–'
  return v.toPrecision(digits).replace(/^-/, '−')
}

/** "2026-12-03 16:22:05 UTC" or "2026-12-03 17:22:05 CET (UTC+01:00)": the date and time in the report's time zone, named. */
export function dateTime(d: Date, timeZone: string): string {
  const parts = new Intl.DateTimeFormat('en-GB', {
    timeZone,
    year: 'numeric',
    month: '2-digit',
    day: '2-digit',
    hour: '2-digit',
    minute: '2-digit',
    second: '2-digit',
    hourCycle: 'h23',
    timeZoneName: 'longOffset',
  }).formatToParts(d)
  const get = (t: string) => parts.find((p) => p.type === t)?.value ?? ''
  const offset = get('timeZoneName').replace('GMT', 'UTC') || 'UTC'
  const zone =
    timeZone === 'UTC' || timeZone === 'Etc/UTC' ? 'UTC' : `${timeZone} (${offset === 'UTC' ? 'UTC+00:00' : offset})`
  return `${get('year')}-${get('month')}-${get('day')} ${get('hour')}:${get('minute')}:${get('second')} ${zone}`
}

/** A SHA-256 digest in four groups of sixteen, easier to compare by eye. */
export function groupedDigest(hex: string): string {
  return hex.match(/.{1,16}/g)?.join(' ') ?? hex
}

/** The report number as printed: R-000042. */
export const reportNumber = (n: number) => `R-${String(n).padStart(6, '0')}`

/** The watermark a version in this state carries, or null (approved versions carry none). */
export function watermarkFor(state: string): string | null {
  if (state === 'approved') return null
  if (state === 'superseded') return 'SUPERSEDED'
  return 'DRAFT · NOT APPROVED'
}

/** What a state means on paper. */
export function stateText(state: string): string {
  return (
    {
      draft: 'Draft: not submitted, not approved. Values may still change.',
      submitted: 'Submitted for approval: not yet approved. Values may still change.',
      returned: 'Returned for rework: not approved. Values may still change.',
      approved: 'Approved: signed by a lead chemist (see the signature manifest).',
      superseded: 'Superseded: approved once, since replaced by a later approved version.',
    }[state] ?? state
  )
}

/** Where the numbers come from, in words, with the full citation of literature data. */
export function originText(d: {
  origin?: 'gc' | 'other-method' | 'literature'
  originMethod?: string | null
  citation?: {
    authors: string
    title: string
    source: string
    year: number
    volume: string | null
    pages: string | null
    doi: string | null
    table: string | null
  } | null
  countsAsOwn?: boolean
  countsAsOwnReason?: string | null
}): string {
  if (d.origin === 'other-method')
    return `Measured here by another method${d.originMethod ? `: ${d.originMethod}` : ''}`
  if (d.origin === 'literature') {
    const c = d.citation
    const cite = c
      ? `${c.authors} (${c.year}). ${c.title}. ${c.source}${c.volume ? ` ${c.volume}` : ''}${c.pages ? `, ${c.pages}` : ''}.${c.table ? ` ${c.table}.` : ''}${c.doi ? ` doi:${c.doi}` : ''}`
      : 'citation not recorded'
    const own = d.countsAsOwn
      ? ` Marked by a lead chemist as the lab's own measurement${d.countsAsOwnReason ? `: ${d.countsAsOwnReason}` : ''}.`
      : ''
    return `Literature data: ${cite}${own}`
  }
  return 'Measured here by GC'
}

/** "at 101.325 kPa" (isobaric) or "at 323.15 K (50.00 °C)" (isothermal). */
export function conditionText(d: { nominalPressurePa: number | null; nominalTemperatureK: number | null }): string {
  if (d.nominalTemperatureK !== null)
    return `at ${d.nominalTemperatureK.toFixed(2)} K (${(d.nominalTemperatureK - 273.15).toFixed(2)} °C)`
  return d.nominalPressurePa !== null ? `at ${(d.nominalPressurePa / 1000).toFixed(3)} kPa` : ''
}
