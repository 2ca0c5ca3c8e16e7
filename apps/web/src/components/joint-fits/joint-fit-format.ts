/** Pure helpers of the joint-fit screens (lab system page and the engineer's view); no engine code. */
import { jointFitLabel, type JointFitDto } from '@ebullio/schemas'
import { fixedText } from '../../stores/preferences'

/** The set's name as every screen and export gives it: "NRTL (joint, 2 data sets)". */
export function jointLabel(f: Pick<JointFitDto, 'model' | 'members' | 'options'>, note?: string): string {
  return jointFitLabel(
    {
      model: f.model,
      dataSetCount: f.members.length,
      temperatureDependent: f.options.temperatureDependent !== false,
    },
    note,
  )
}

/** Units of the fitted parameters (thermo's names): energies J/mol, their temperature terms J/(mol·K). */
export function parameterUnit(name: string): string {
  if (/^[ab](12|21)T$/.test(name)) return 'J/(mol·K)'
  if (/^[ab](12|21)$/.test(name)) return 'J/mol'
  return '1'
}

export const STATE_WORDS: Record<JointFitDto['state'], string> = {
  draft: 'Draft',
  submitted: 'Awaiting signature',
  returned: 'Returned for rework',
  approved: 'Recommended for the system',
  superseded: 'Superseded',
}

export const STATE_SEVERITY: Record<JointFitDto['state'], 'secondary' | 'warn' | 'success' | 'contrast' | 'danger'> = {
  draft: 'secondary',
  submitted: 'warn',
  returned: 'danger',
  approved: 'success',
  superseded: 'contrast',
}

/** "1234.5 ± 12.3" with the standard error to 2 significant figures and the value to the same decimal place. */
export function valueWithError(value: number, se: number | null): string {
  if (se === null || !Number.isFinite(se) || se <= 0) return value.toPrecision(5)
  const decimals = Math.max(0, 1 - Math.floor(Math.log10(se)))
  return `${value.toFixed(decimals)} ± ${se.toFixed(decimals)}`.replace(/-/g, '−')
}

/** Parameters as table rows with their units. */
export function parameterRows(f: Pick<JointFitDto, 'parameters'>) {
  return f.parameters.map((p) => ({
    name: p.name,
    value: p.value,
    standardError: p.standardError,
    shown: valueWithError(p.value, p.standardError),
    unit: parameterUnit(p.name),
  }))
}

/**
 * What the set holds but did not fit, from its activity model: NRTL's α, Wilson's V1 and V2 (cm³/mol), UNIQUAC's
 * r and q of both components (dimensionless), each with its unit.
 */
export function heldRows(f: Pick<JointFitDto, 'parameters' | 'activity'>) {
  const fitted = new Set(f.parameters.map((p) => p.name))
  return Object.entries(f.activity)
    .filter(([k, v]) => k !== 'kind' && !fitted.has(k) && typeof v === 'number')
    .sort(([a], [b]) => a.localeCompare(b))
    .map(([name, v]) => ({
      name: name === 'alpha' ? 'α' : name,
      shown: (v as number).toPrecision(5),
      unit: /^V[12]$/.test(name) ? 'cm³/mol' : '1',
    }))
}

/** The latest return for rework of a joint fit (its reason, who and when), or null when it was never returned. */
export function lastReturn(f: Pick<JointFitDto, 'signatures'>) {
  return f.signatures.filter((s) => s.meaning === 'returned for rework').at(-1) ?? null
}

/** A failure in words for the screen: the server's message, or what went wrong. */
export function errorText(e: unknown): string {
  return e instanceof Error ? e.message : String(e)
}

/**
 * A statistic with a fixed number of decimals and the true minus sign; `signed` puts + before a positive value. A value
 * that rounds to zero reads 0.0000 (never −0.0000 or +0.0000: a bias too small to show has no sign); "—" when missing.
 */
export function statText(v: number | null | undefined, digits: number, signed = false): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return '—'
  const s = fixedText(v, digits)
  return signed && !s.startsWith('−') && Number(s) !== 0 ? `+${s}` : s
}
