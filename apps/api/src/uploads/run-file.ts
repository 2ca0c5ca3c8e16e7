/**
 * The Ebullio run sheet (docs/csv-formats.md): one row per GC injection of an equilibrium
 * sample's liquid or vapour phase, with the sample's boiling temperature and barometric
 * pressure on at least one of its rows. Columns: sample, phase, injection, area_1, area_2,
 * t_boil, t_unit, p_baro, p_unit; optional `layers` (2 when the liquid in the still had split into two
 * layers), with the layers' own injections as phases `upper` and `lower`. A sample of one pure component has the
 * absent component's area 0 or empty (run-pure.ts); check standards are rows of phase `check` with their known
 * x1 in the optional column `check_x1` (run-checks.ts).
 */
import { toKelvin, toPascal, type PressureUnitName, type TemperatureUnitName } from '@ebullio/thermo'
import { injectionCell, type ParsedInjection } from './calibration-file.js'
import {
  DEFAULT_READ_LIMITS,
  mapColumns,
  parseNumber,
  readCsvTable,
  readCsvTableAsync,
  type ColumnMapping,
  type CsvFormat,
  type CsvTable,
  type ReadLimits,
} from './csv-table.js'
import { uploadError, type UploadProblem } from './problems.js'
import { CHECK_PHASES, finishChecks, readCheckRow, type RunCheck } from './run-checks.js'
import { checkLayers, PHASE_WORDS, readLayers } from './run-layers.js'
import { bothAreasMissing, pureComponentOf, runAreaCell } from './run-pure.js'

export const RUN_REQUIRED = [
  'sample',
  'phase',
  'injection',
  'area_1',
  'area_2',
  't_boil',
  't_unit',
  'p_baro',
  'p_unit',
] as const
export const RUN_OPTIONAL = ['layers', 'check_x1'] as const

/** Plausible bounds for a boiling measurement (SI). Defaults: 150–650 K, 0.5 kPa–5 MPa. */
export interface PlausibleBounds {
  temperatureK: [number, number]
  pressurePa: [number, number]
}
export const DEFAULT_BOUNDS: PlausibleBounds = { temperatureK: [150, 650], pressurePa: [500, 5e6] }

const TEMPERATURE_UNITS: Record<string, TemperatureUnitName> = {
  c: 'C',
  '°c': 'C',
  degc: 'C',
  k: 'K',
  f: 'F',
  '°f': 'F',
  degf: 'F',
}
const PRESSURE_UNITS: Record<string, PressureUnitName> = Object.fromEntries(
  (['Pa', 'kPa', 'MPa', 'bar', 'mbar', 'atm', 'mmHg', 'torr', 'psi'] as PressureUnitName[]).map((u) => [
    u.toLowerCase(),
    u,
  ]),
)
export type RunPhase = 'liquid' | 'vapour' | 'upper' | 'lower'
const PHASES: Record<string, RunPhase> = {
  liquid: 'liquid',
  l: 'liquid',
  liq: 'liquid',
  vapour: 'vapour',
  vapor: 'vapour',
  v: 'vapour',
  vap: 'vapour',
  upper: 'upper',
  top: 'upper',
  lower: 'lower',
  bottom: 'lower',
}

/** One equilibrium state gathered from its rows. */
export interface RunSample {
  label: string
  firstRow: number
  rows: number[]
  temperatureK: number
  pressurePa: number
  raw: { temperature: string; temperatureUnit: string; pressure: string; pressureUnit: string }
  /** injections of the whole liquid (for a two-layer sample: its overall composition) */
  liquid: ParsedInjection[]
  vapour: ParsedInjection[]
  /** the analyst saw two liquid layers in the still (`layers` = 2) */
  heterogeneous: boolean
  /** injections of each separated layer of a two-layer sample; both empty when the layers were not analysed */
  upper: ParsedInjection[]
  lower: ParsedInjection[]
  /** every line of the sample by the phase it names (`unknown`: phase missing or unreadable), used or not */
  phaseRows: PhaseRows
  /** a sample of one pure component (the other's area 0 or empty on every row): x1 = y1 = 1 or 0 exactly */
  pureComponent: 1 | 2 | null
}

/** The lines of one sample by phase, so a preview can say "1 of 2 injections used". */
export interface PhaseRows {
  liquid: number[]
  vapour: number[]
  upper: number[]
  lower: number[]
  unknown: number[]
}

export interface RunFileParse {
  format: CsvFormat
  mapping: Record<string, string>
  extraColumns: string[]
  header: string[]
  rows: { line: number; cells: string[] }[]
  samples: RunSample[]
  /** check standards run with the samples (phase `check`) */
  checks: RunCheck[]
  problems: UploadProblem[]
}

export interface Draft {
  label: string
  rows: number[]
  t?: { value: number; unit: TemperatureUnitName; raw: string; rawUnit: string; line: number }
  p?: { value: number; unit: PressureUnitName; raw: string; rawUnit: string; line: number }
  layers?: { value: 1 | 2; raw: string; line: number }
  liquid: ParsedInjection[]
  vapour: ParsedInjection[]
  upper: ParsedInjection[]
  lower: ParsedInjection[]
  phaseRows: PhaseRows
}

export type Cells = (name: string) => string

/** Read the optional T and P cells of a row into the sample; conflicting repeats are problems. */
function readConditions(cell: Cells, line: number, dc: boolean, s: Draft, problems: UploadProblem[]): void {
  const pairs = [
    {
      key: 't' as const,
      value: 't_boil',
      unit: 't_unit',
      units: TEMPERATURE_UNITS as Record<string, string>,
      what: 'temperature',
      hint: 'C, K or F',
    },
    {
      key: 'p' as const,
      value: 'p_baro',
      unit: 'p_unit',
      units: PRESSURE_UNITS as Record<string, string>,
      what: 'pressure',
      hint: 'Pa, kPa, MPa, bar, mbar, atm, mmHg, torr or psi',
    },
  ]
  for (const pr of pairs) {
    const raw = cell(pr.value)
    if (raw === '') continue
    const value = parseNumber(raw, dc)
    if (value === null) {
      problems.push(uploadError(line, pr.value, raw, 'Not a number.'))
      continue
    }
    const rawUnit = cell(pr.unit)
    const unit = pr.units[rawUnit.toLowerCase()]
    if (!unit) {
      problems.push(uploadError(line, pr.unit, rawUnit, `Unknown ${pr.what} unit; use ${pr.hint}.`))
      continue
    }
    const prev = s[pr.key]
    if (prev && (prev.value !== value || prev.unit !== unit)) {
      problems.push(
        uploadError(line, pr.value, raw, `Sample ${s.label} has a different ${pr.what} on line ${prev.line}.`),
      )
    } else if (!prev) {
      s[pr.key] = { value, unit, raw, rawUnit, line } as never
    }
  }
}

type Drafts = { samples: Map<string, Draft>; checks: Parameters<typeof readCheckRow>[3] }

function readRow(cell: Cells, line: number, dc: boolean, drafts: Drafts, problems: UploadProblem[]): void {
  const label = cell('sample')
  if (label === '') {
    problems.push(uploadError(line, 'sample', '', 'Sample id is missing.'))
    return
  }
  if (CHECK_PHASES.has(cell('phase').toLowerCase())) return readCheckRow(cell, line, dc, drafts.checks, problems)
  const samples = drafts.samples
  let s = samples.get(label)
  if (!s) {
    s = {
      label,
      rows: [],
      liquid: [],
      vapour: [],
      upper: [],
      lower: [],
      phaseRows: { liquid: [], vapour: [], upper: [], lower: [], unknown: [] },
    }
    samples.set(label, s)
  }
  s.rows.push(line)
  readConditions(cell, line, dc, s, problems)
  readLayers(cell, line, s, problems)
  const phaseRaw = cell('phase')
  const phase = PHASES[phaseRaw.toLowerCase()]
  s.phaseRows[phase ?? 'unknown'].push(line)
  if (phaseRaw === '') problems.push(uploadError(line, 'phase', '', 'Phase is missing; use liquid or vapour.'))
  else if (!phase)
    problems.push(uploadError(line, 'phase', phaseRaw, 'Phase must be liquid, vapour, upper, lower or check.'))
  const injection = injectionCell(cell, line, dc, problems)
  const area1 = runAreaCell(cell, 'area_1', line, dc, problems)
  const area2 = runAreaCell(cell, 'area_2', line, dc, problems)
  if (area1 === 0 && area2 === 0) return bothAreasMissing(line, cell('area_1'), problems)
  if (!phase || injection === null || area1 === null || area2 === null) return
  const list = s[phase]
  if (list.some((i) => i.injection === injection)) {
    problems.push(
      uploadError(
        line,
        'injection',
        cell('injection'),
        `Injection ${injection} of the ${PHASE_WORDS[phase]} of sample ${label} appears twice.`,
      ),
    )
  } else {
    list.push({ injection, area1, area2, row: line })
  }
}

/** How the run is read: `liquidOnly` for T–x and P–x data (no vapour analysed). */
export interface RunReadOptions {
  liquidOnly?: boolean
}

/** Turn a gathered sample into SI values, listing what is missing or implausible. */
function finishSample(
  s: Draft,
  bounds: PlausibleBounds,
  problems: UploadProblem[],
  o: RunReadOptions = {},
): RunSample | null {
  const first = s.rows[0]
  const pure = pureComponentOf(s, problems)
  if (o.liquidOnly && s.vapour.length > 0 && !pure)
    problems.push(
      uploadError(
        s.vapour[0].row,
        'phase',
        s.label,
        `Sample ${s.label} has vapour injections, but this data set has no vapour composition (T–x or P–x); leave the vapour rows out or choose a T–x–y or P–x–y data set.`,
      ),
    )
  // A pure liquid boils to the same vapour: its vapour rows may be left out.
  if (!o.liquidOnly && s.liquid.length > 0 && s.vapour.length === 0 && pure === null)
    problems.push(
      uploadError(first, 'phase', s.label, `Sample ${s.label} has liquid injections but no vapour injection.`),
    )
  if (s.vapour.length > 0 && s.liquid.length === 0)
    problems.push(
      uploadError(first, 'phase', s.label, `Sample ${s.label} has vapour injections but no liquid injection.`),
    )
  if (!s.t) problems.push(uploadError(first, 't_boil', null, `Sample ${s.label} has no boiling temperature.`))
  if (!s.p) problems.push(uploadError(first, 'p_baro', null, `Sample ${s.label} has no pressure.`))
  const layersOk = checkLayers(s, problems)
  const vapourOk = o.liquidOnly ? s.vapour.length === 0 || !!pure : s.vapour.length > 0 || !!pure
  if (!s.t || !s.p || s.liquid.length === 0 || !vapourOk || !layersOk || pure === false) return null
  const temperatureK = toKelvin(s.t.value, s.t.unit)
  const pressurePa = toPascal(s.p.value, s.p.unit)
  const [tMin, tMax] = bounds.temperatureK
  const [pMin, pMax] = bounds.pressurePa
  let ok = true
  if (!(temperatureK >= tMin && temperatureK <= tMax)) {
    ok = false
    problems.push(
      uploadError(
        s.t.line,
        't_boil',
        s.t.raw,
        `Boiling temperature ${temperatureK.toFixed(2)} K is outside the plausible range ${tMin}–${tMax} K.`,
      ),
    )
  }
  if (!(pressurePa >= pMin && pressurePa <= pMax)) {
    ok = false
    problems.push(
      uploadError(
        s.p.line,
        'p_baro',
        s.p.raw,
        `Pressure ${(pressurePa / 1000).toFixed(3)} kPa is outside the plausible range ${pMin / 1000}–${pMax / 1000} kPa.`,
      ),
    )
  }
  if (!ok) return null
  return {
    label: s.label,
    firstRow: first,
    rows: s.rows,
    temperatureK,
    pressurePa,
    raw: { temperature: s.t.raw, temperatureUnit: s.t.rawUnit, pressure: s.p.raw, pressureUnit: s.p.rawUnit },
    liquid: s.liquid,
    vapour: s.vapour,
    heterogeneous: s.layers?.value === 2,
    upper: s.upper,
    lower: s.lower,
    phaseRows: s.phaseRows,
    pureComponent: pure,
  }
}

/** Parse a run sheet. Pure: no database; compositions are computed later with a calibration. */
export function parseRunFile(
  content: Buffer | string,
  bounds: PlausibleBounds = DEFAULT_BOUNDS,
  limits: ReadLimits = DEFAULT_READ_LIMITS,
  o: RunReadOptions = {},
): RunFileParse {
  return parseRunTable(readCsvTable(content, limits), bounds, o)
}

/** `parseRunFile` for the server: the CSV is read in slices so a large file does not hold the event loop. */
export async function parseRunFileAsync(
  content: Buffer | string,
  bounds: PlausibleBounds = DEFAULT_BOUNDS,
  limits: ReadLimits = DEFAULT_READ_LIMITS,
  o: RunReadOptions = {},
): Promise<RunFileParse> {
  return parseRunTable(await readCsvTableAsync(content, limits), bounds, o)
}

/** The run sheet's samples from a table already read; an unreadable file keeps its one problem and nothing else. */
export function parseRunTable(
  table: CsvTable,
  bounds: PlausibleBounds = DEFAULT_BOUNDS,
  o: RunReadOptions = {},
): RunFileParse {
  const unreadable = table.problems.length > 0
  const map: ColumnMapping = unreadable
    ? { columns: {}, extraColumns: [], problems: [] }
    : mapColumns(table.header, RUN_REQUIRED, RUN_OPTIONAL)
  const problems = [...table.problems, ...map.problems]
  const base = {
    format: table.format,
    mapping: Object.fromEntries(Object.entries(map.columns).map(([k, v]) => [k, v.header])),
    extraColumns: map.extraColumns,
    header: table.header,
    rows: table.rows,
  }
  if (problems.length > 0) return { ...base, samples: [], checks: [], problems }
  const drafts: Drafts = { samples: new Map(), checks: new Map() }
  for (const row of table.rows) {
    const cell: Cells = (name) => {
      const col = map.columns[name]
      return col ? (row.cells[col.index] ?? '').trim() : ''
    }
    readRow(cell, row.line, table.format.decimalComma, drafts, problems)
  }
  if (table.rows.length === 0) problems.push(uploadError(null, null, null, 'The file has a header but no data rows.'))
  const samples: RunSample[] = []
  for (const d of drafts.samples.values()) {
    const s = finishSample(d, bounds, problems, o)
    if (s) samples.push(s)
  }
  const checks = finishChecks(drafts.checks, new Set(drafts.samples.keys()), problems)
  problems.sort((a, b) => (a.row ?? 0) - (b.row ?? 0))
  return { ...base, samples, checks, problems }
}
