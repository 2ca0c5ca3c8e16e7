import { fromKelvin, PASCALS_PER, temperatureDifferenceFromKelvin, toKelvin } from '@ebullio/thermo/units'
import { defineStore } from 'pinia'
import { ref, watch } from 'vue'

/** Temperature display units: degrees Celsius, kelvin or degrees Fahrenheit. */
export type TemperatureChoice = 'C' | 'K' | 'F'
/** Pressure display units offered in the picker. */
export type PressureChoice = 'kPa' | 'mmHg' | 'bar' | 'atm' | 'psi'

export const TEMPERATURE_CHOICES: { value: TemperatureChoice; label: string }[] = [
  { value: 'C', label: '°C' },
  { value: 'K', label: 'K' },
  { value: 'F', label: '°F' },
]
export const PRESSURE_CHOICES: { value: PressureChoice; label: string }[] = [
  { value: 'kPa', label: 'kPa' },
  { value: 'mmHg', label: 'mmHg' },
  { value: 'bar', label: 'bar' },
  { value: 'atm', label: 'atm' },
  { value: 'psi', label: 'psi' },
]

/**
 * Pascals per display unit: the engine's one table of factors (`@ebullio/thermo/units`, exact definitions with
 * their sources), which imports nothing else of the engine, so the first page stays small.
 */
export const PA_PER: Readonly<Record<PressureChoice, number>> = Object.fromEntries(
  PRESSURE_CHOICES.map((c) => [c.value, PASCALS_PER[c.value]]),
) as Record<PressureChoice, number>
/** Decimals that keep a typical laboratory reading meaningful in each unit. */
const P_DECIMALS: Record<PressureChoice, number> = { kPa: 2, mmHg: 1, bar: 4, atm: 4, psi: 3 }

/**
 * The one rounding rule for a shown number: half away from zero on its shortest decimal form (Intl, as PrimeVue's
 * InputNumber formats), so a field and a label show the same digits (101325 Pa is 1.0133 bar in both).
 */
export function roundShown(v: number, decimals: number): string {
  return new Intl.NumberFormat('en-US', {
    useGrouping: false,
    minimumFractionDigits: decimals,
    maximumFractionDigits: decimals,
  }).format(v)
}

/**
 * `v.toFixed(decimals)` with the true minus sign "−" (U+2212) for negatives, as the other screens write them;
 * a value that rounds to zero shows no sign ("0.00", never "−0.00").
 */
export function fixedText(v: number, decimals: number): string {
  const s = v.toFixed(decimals)
  return /^-0(\.0*)?$/.test(s) ? s.slice(1) : s.replace(/^-/, '−')
}

const KEY = 'ebullio.units'

function readStored(): { t: TemperatureChoice; p: PressureChoice } {
  try {
    const v = JSON.parse(localStorage.getItem(KEY) ?? '{}') as { t?: string; p?: string }
    return {
      t: v.t === 'K' || v.t === 'F' ? v.t : 'C',
      p: (['kPa', 'mmHg', 'bar', 'atm', 'psi'] as string[]).includes(v.p ?? '') ? (v.p as PressureChoice) : 'kPa',
    }
  } catch {
    return { t: 'C', p: 'kPa' }
  }
}

/** The signed-in person's display units, remembered in this browser (localStorage). Everything is stored in K and Pa. */
export const usePreferencesStore = defineStore('preferences', () => {
  const stored = readStored()
  const temperatureUnit = ref<TemperatureChoice>(stored.t)
  const pressureUnit = ref<PressureChoice>(stored.p)
  watch([temperatureUnit, pressureUnit], ([t, p]) => localStorage.setItem(KEY, JSON.stringify({ t, p })))

  /** Label of the temperature unit ("°C", "K" or "°F"). */
  const tLabel = () => ({ C: '°C', K: 'K', F: '°F' })[temperatureUnit.value]
  /** Label of a temperature difference: "K" for °C and K, "°F" for °F. */
  const dTLabel = () => (temperatureUnit.value === 'F' ? '°F' : 'K')
  /** Label of the pressure unit. */
  const pLabel = () => pressureUnit.value

  /** Kelvin → display value (the engine's conversion). */
  const tFromK = (T: number) => fromKelvin(T, temperatureUnit.value)
  /** Display value → kelvin. */
  const tToK = (v: number) => toKelvin(v, temperatureUnit.value)
  /** A temperature difference in K → the display unit's difference (the same number in °C, × 9/5 in °F). */
  const dT = (d: number) => temperatureDifferenceFromKelvin(d, temperatureUnit.value)
  /** Pascal → display value. */
  const pFromPa = (P: number) => P / PA_PER[pressureUnit.value]
  /** Display value → pascal. */
  const pToPa = (v: number) => v * PA_PER[pressureUnit.value]
  /** Decimals shown for a pressure in the chosen unit. */
  const pDecimals = () => P_DECIMALS[pressureUnit.value]
  /** Pascal → the display value rounded as everywhere it is shown (fields and labels alike). */
  const pShown = (P: number) => Number(roundShown(pFromPa(P), pDecimals()))

  /** "63.12 °C" from kelvin ("−40.00 °C" with the true minus sign). */
  const fmtT = (T: number | null | undefined, decimals = 2) =>
    T === null || T === undefined || !Number.isFinite(T) ? '—' : `${fixedText(tFromK(T), decimals)} ${tLabel()}`
  /** "0.121 °F" from a difference in K ("+0.12 K" or "−0.09 K" with `signed`); "—" when missing. */
  const fmtDT = (d: number | null | undefined, decimals = 3, signed = false) => {
    if (d === null || d === undefined || !Number.isFinite(d)) return '—'
    const s = fixedText(dT(d), decimals)
    return `${signed && !s.startsWith('−') ? '+' : ''}${s} ${dTLabel()}`
  }
  /** "101.33 kPa" from pascal. */
  const fmtP = (P: number | null | undefined, decimals?: number) =>
    P === null || P === undefined || !Number.isFinite(P)
      ? '—'
      : `${roundShown(pFromPa(P), decimals ?? pDecimals())} ${pLabel()}`
  /**
   * The condition a series was measured at: "55.00 °C (isothermal)" for isothermal data (its temperature is set),
   * else its nominal pressure ("101.33 kPa"); "—" when neither is known.
   */
  const fmtCondition = (d: { nominalPressurePa: number | null; nominalTemperatureK?: number | null }) =>
    d.nominalTemperatureK !== null && d.nominalTemperatureK !== undefined
      ? `${fmtT(d.nominalTemperatureK)} (isothermal)`
      : fmtP(d.nominalPressurePa)

  return {
    temperatureUnit,
    pressureUnit,
    tLabel,
    dTLabel,
    pLabel,
    tFromK,
    tToK,
    dT,
    pFromPa,
    pToPa,
    pDecimals,
    pShown,
    fmtT,
    fmtDT,
    fmtP,
    fmtCondition,
  }
})
