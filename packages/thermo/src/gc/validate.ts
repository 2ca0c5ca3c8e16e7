/** Boundary checks for GC input: every bad value is named so the analyst can find the vial and the injection. */
import { ThermoError } from '../errors.js'
import type { CalibrationStandard, Injection } from './gc-types.js'

function describe(v: unknown): string {
  return typeof v === 'number' ? String(v) : (JSON.stringify(v) ?? String(v))
}

/** Check one injection; `where` prefixes the message, e.g. "Standard 2, injection 1". Zero, negative or missing areas are errors. */
export function checkInjection(where: string, injection: Injection | undefined): void {
  if (injection === null || typeof injection !== 'object') {
    throw new ThermoError('invalid-area', `${where}: the injection is missing its peak areas.`)
  }
  for (const key of ['area1', 'area2'] as const) {
    const v = (injection as unknown as Record<string, unknown>)[key]
    if (v === undefined || v === null)
      throw new ThermoError('invalid-area', `${where}: ${key} is missing.`, { field: key })
    if (typeof v !== 'number' || !Number.isFinite(v) || v <= 0) {
      throw new ThermoError('invalid-area', `${where}: ${key} must be a positive peak area; got ${describe(v)}.`, {
        field: key,
        value: v,
      })
    }
  }
}

/** Check the injections of a sample or a standard: at least one, each with two positive areas. */
export function checkInjections(where: string, injections: Injection[] | undefined, prefix: string): void {
  if (!Array.isArray(injections) || injections.length === 0) {
    throw new ThermoError('no-injections', `${where} has no injections.`)
  }
  injections.forEach((inj, i) => checkInjection(prefix ? `${prefix}injection ${i + 1}` : `Injection ${i + 1}`, inj))
}

/** Molar masses for the mass-to-mole conversion: two positive numbers in g/mol. */
export function checkMolarMasses(m: unknown): asserts m is [number, number] {
  const ok = Array.isArray(m) && m.length === 2 && m.every((v) => typeof v === 'number' && Number.isFinite(v) && v > 0)
  if (!ok)
    throw new ThermoError(
      'invalid-molar-masses',
      `molarMasses must be two positive numbers in g/mol; got ${describe(m)}.`,
    )
}

/** Mole fraction x1 of a standard, converting a mass fraction w1 with the molar masses (g/mol). */
export function standardMoleFraction(s: CalibrationStandard, index: number, molarMasses?: [number, number]): number {
  const where = `Standard ${index + 1}`
  const c = (s?.composition ?? {}) as Record<string, unknown>
  const hasX = c.x1 !== undefined
  const hasW = c.w1 !== undefined
  if (hasX && hasW)
    throw new ThermoError(
      'invalid-standard',
      `${where}: give the composition as x1 (mole fraction) or w1 (mass fraction), not both.`,
    )
  if (!hasX && !hasW) throw new ThermoError('invalid-standard', `${where}: the composition is missing; give x1 or w1.`)
  const key = hasX ? 'x1' : 'w1'
  const v = c[key]
  if (typeof v !== 'number' || !Number.isFinite(v) || v <= 0 || v >= 1) {
    throw new ThermoError('invalid-standard', `${where}: ${key} must lie strictly between 0 and 1; got ${describe(v)}.`)
  }
  if (hasX) return v
  if (molarMasses === undefined) {
    throw new ThermoError(
      'molar-masses-required',
      `${where} is given as a mass fraction: pass molarMasses [M1, M2] in g/mol to convert it.`,
    )
  }
  const n1 = v / molarMasses[0]
  const n2 = (1 - v) / molarMasses[1]
  return n1 / (n1 + n2)
}
