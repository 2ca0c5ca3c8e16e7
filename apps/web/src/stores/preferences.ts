import { defineStore } from 'pinia'
import { ref, watch } from 'vue'

/** Temperature display units: degrees Celsius or kelvin. */
export type TemperatureChoice = 'C' | 'K'
/** Pressure display units offered in the picker. */
export type PressureChoice = 'kPa' | 'mmHg' | 'bar' | 'atm'

export const TEMPERATURE_CHOICES: { value: TemperatureChoice; label: string }[] = [
  { value: 'C', label: '°C' },
  { value: 'K', label: 'K' },
]
export const PRESSURE_CHOICES: { value: PressureChoice; label: string }[] = [
  { value: 'kPa', label: 'kPa' },
  { value: 'mmHg', label: 'mmHg' },
  { value: 'bar', label: 'bar' },
  { value: 'atm', label: 'atm' },
]

/**
 * Pascals per display unit. Kept here rather than imported from @ebullio/thermo's units module,
 * which pulls mathjs into the first page; the values are the same conventional ones
 * (BIPM SI Brochure, 9th ed., 2019, Table 8: 1 mmHg = 133.322387415 Pa, 1 atm = 101325 Pa, 1 bar = 1e5 Pa).
 */
export const PA_PER: Readonly<Record<PressureChoice, number>> = { kPa: 1000, mmHg: 133.322387415, bar: 1e5, atm: 101325 }
/** Decimals that keep a typical laboratory reading meaningful in each unit. */
const P_DECIMALS: Record<PressureChoice, number> = { kPa: 2, mmHg: 1, bar: 4, atm: 4 }

const KEY = 'ebullio.units'

function readStored(): { t: TemperatureChoice; p: PressureChoice } {
  try {
    const v = JSON.parse(localStorage.getItem(KEY) ?? '{}') as { t?: string; p?: string }
    return {
      t: v.t === 'K' ? 'K' : 'C',
      p: (['kPa', 'mmHg', 'bar', 'atm'] as string[]).includes(v.p ?? '') ? (v.p as PressureChoice) : 'kPa',
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

  /** Label of the temperature unit ("°C" or "K"). */
  const tLabel = () => (temperatureUnit.value === 'C' ? '°C' : 'K')
  /** Label of the pressure unit. */
  const pLabel = () => pressureUnit.value

  /** Kelvin → display value. */
  const tFromK = (T: number) => (temperatureUnit.value === 'C' ? T - 273.15 : T)
  /** Display value → kelvin. */
  const tToK = (v: number) => (temperatureUnit.value === 'C' ? v + 273.15 : v)
  /** A temperature difference in K is the same number in °C; kept for readability at call sites. */
  const dT = (d: number) => d
  /** Pascal → display value. */
  const pFromPa = (P: number) => P / PA_PER[pressureUnit.value]
  /** Display value → pascal. */
  const pToPa = (v: number) => v * PA_PER[pressureUnit.value]

  /** "63.12 °C" from kelvin. */
  const fmtT = (T: number | null | undefined, decimals = 2) =>
    T === null || T === undefined || !Number.isFinite(T) ? '—' : `${tFromK(T).toFixed(decimals)} ${tLabel()}`
  /** "101.33 kPa" from pascal. */
  const fmtP = (P: number | null | undefined, decimals?: number) =>
    P === null || P === undefined || !Number.isFinite(P) ? '—' : `${pFromPa(P).toFixed(decimals ?? P_DECIMALS[pressureUnit.value])} ${pLabel()}`

  return { temperatureUnit, pressureUnit, tLabel, pLabel, tFromK, tToK, dT, pFromPa, pToPa, fmtT, fmtP }
})
