/** Ebullio's plot look and the helpers every plot shares: palette, axes, unit labels, file export. */
import { slugify } from '@ebullio/schemas/csv-exports'
import { fromKelvin, temperatureDifferenceFromKelvin } from '@ebullio/thermo/units'
import type { TemperatureUnit } from './plot-types'

/** Curve colours in order of use (slate blue, plum, moss, brick, deep teal, ochre): none is the colour of a measured point. */
export const CURVE_COLOURS = ['#2c5d9e', '#7a3e8e', '#4d7f2a', '#b0452b', '#0e3238', '#8a6a12']
export const INK = '#221f1b'
export const MUTED = '#635e53'
export const LINE = '#e0ddd5'
export const WARN = '#a3321f'
/**
 * Decimals ECharts keeps of a mark line's value. Its default, 2, moves a line to the rounded value: GC check-standard
 * limits of ±0.0035 and a Δy₁ band of ±0.001 were drawn on zero (mark-lines.test.ts).
 */
export const MARK_PRECISION = 12
/** Liquid points are teal circles, vapour points amber diamonds: shape and colour both tell them apart. */
export const LIQUID = { colour: '#1a545c', symbol: 'circle' }
export const VAPOUR = { colour: '#c98a12', symbol: 'diamond' }

/** Temperature in kelvin → the shown unit (the engine's conversion). */
export function showT(T: number, unit: TemperatureUnit): number {
  return fromKelvin(T, unit)
}

/** A temperature difference in K → the shown unit (× 9/5 in °F). */
export function showDT(d: number, unit: TemperatureUnit): number {
  return temperatureDifferenceFromKelvin(d, unit)
}

/** The unit's symbol: "°C", "K" or "°F". */
export function tUnit(unit: TemperatureUnit): string {
  return unit === 'C' ? '°C' : unit === 'F' ? '°F' : 'K'
}

/** Axis label of a temperature: "T / °C", "T / K" or "T / °F". */
export function tLabel(unit: TemperatureUnit): string {
  return `T / ${tUnit(unit)}`
}

/**
 * Text for an ECharts tooltip, which renders its formatter's string as HTML: every name that comes from the
 * lab (sample labels, exclusion reasons, component, system and fit names) goes through this, so markup stays
 * text. Labels drawn on the chart itself (canvas or SVG text) need no escaping.
 */
export function escapeHtml(s: unknown): string {
  return String(s ?? '').replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!,
  )
}

/** A number for a tooltip, with a fixed count of decimals and no trailing noise. */
export function fmt(v: number | null | undefined, digits = 4): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return '–'
  // a value that rounds to zero shows no sign ("0.0000", never "-0.0000"); negatives take the true minus "−"
  const s = v.toFixed(digits)
  return /^-0(\.0*)?$/.test(s) ? s.slice(1) : s.replace(/^-/, '−')
}

/** Value axis with Ebullio's grid look. */
export function valueAxis(name: string, extra: Record<string, unknown> = {}): Record<string, unknown> {
  return {
    type: 'value',
    name,
    nameLocation: 'middle',
    nameGap: 34,
    nameTextStyle: { color: INK, fontSize: 12, fontWeight: 500 },
    axisLine: { show: true, lineStyle: { color: MUTED } },
    axisTick: { show: true, lineStyle: { color: MUTED } },
    axisLabel: { color: MUTED, fontSize: 11 },
    splitLine: { lineStyle: { color: LINE, type: 'dashed' } },
    ...extra,
  }
}

/** Composition axis fixed to 0–1. */
export function fractionAxis(name: string): Record<string, unknown> {
  return valueAxis(name, {
    min: 0,
    max: 1,
    interval: 0.1,
    axisLabel: { color: MUTED, fontSize: 11, formatter: (v: number) => v.toFixed(1) },
  })
}

/** Shared top-level option pieces: font, legend, tooltip box, grid margins. */
export function baseOption(title: string): Record<string, unknown> {
  return {
    animation: false,
    aria: { enabled: true, label: { description: title } },
    textStyle: { fontFamily: 'Inter, system-ui, sans-serif', color: INK },
    grid: { left: 62, right: 24, top: 44, bottom: 52, containLabel: false },
    tooltip: {
      trigger: 'item',
      backgroundColor: '#fffdf8',
      borderColor: LINE,
      textStyle: { color: INK, fontSize: 12 },
      extraCssText: 'box-shadow: 0 2px 8px #0002; border-radius: 6px;',
    },
  }
}

/**
 * A wrapping legend of the given entries and the grid top that leaves room for it.
 * The row count is estimated from the text length (about 7 px a character plus the swatch) for a half-width plot.
 */
export function legendFor(
  names: string[],
  selected: Record<string, boolean> = {},
  widthPx = 430,
): { legend: Record<string, unknown>; top: number } {
  const widths = names.map((n) => n.length * 6.3 + 44)
  let rows = names.length ? 1 : 0
  let used = 0
  for (const w of widths) {
    if (used + w > widthPx && used > 0) {
      rows++
      used = 0
    }
    used += w
  }
  const legend = {
    type: 'plain',
    top: 4,
    left: 56,
    right: 16,
    data: names,
    selected,
    itemWidth: 22,
    itemHeight: 10,
    itemGap: 14,
    textStyle: { color: INK, fontSize: 12 },
  }
  return { legend, top: 30 + rows * 22 }
}

/** Let the browser save a file the app produced (no server round trip). */
export function saveFile(name: string, content: Blob | string, type = 'text/plain'): void {
  const blob = typeof content === 'string' ? new Blob([content], { type }) : content
  const url = URL.createObjectURL(blob)
  const a = document.createElement('a')
  a.href = url
  a.download = name
  document.body.appendChild(a)
  a.click()
  a.remove()
  setTimeout(() => URL.revokeObjectURL(url), 1000)
}

/** A file name from a plot title: the shared slug (letters of any script kept, lower-case, hyphens). */
export function fileStem(title: string): string {
  return slugify(title, 'plot')
}
