import { readFileSync } from 'node:fs'
import path from 'node:path'
import { fileURLToPath } from 'node:url'
import { describe, expect, it } from 'vitest'
import { parseCalibrationFile } from './calibration-file.js'
import { parseRunFile } from './run-file.js'

// The documented example files (docs/examples, invented data) must read as docs/csv-formats.md says.
const examples = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../../../docs/examples')
const read = (name: string) => readFileSync(path.join(examples, name))

describe('docs/examples', () => {
  it('calibration sheet: eight standards, three injections each, no problems', () => {
    const p = parseCalibrationFile(read('calibration-acetone-methanol.csv'))
    expect(p.problems).toEqual([])
    expect(p.standards.map((s) => s.injections.length)).toEqual([3, 3, 3, 3, 3, 3, 3, 3])
  })

  it('run sheet: twelve samples, no problems', () => {
    const p = parseRunFile(read('run-acetone-methanol.csv'))
    expect(p.problems).toEqual([])
    expect(p.samples).toHaveLength(12)
  })

  it('the spoiled run sheet shows exactly its three planted mistakes', () => {
    const p = parseRunFile(read('run-acetone-methanol-with-errors.csv'))
    expect(p.problems.map((x) => [x.row, x.column, x.value, x.message])).toEqual([
      [5, 'phase', '', 'Phase is missing; use liquid or vapour.'],
      [10, 'area_1', '130x365.0', 'Not a number.'],
      [15, 'area_1', '-147492.9', 'Peak area cannot be negative.'],
    ])
  })

  it('the European export reads to the same samples as the plain one', () => {
    const plain = parseRunFile(read('run-acetone-methanol.csv'))
    const euro = parseRunFile(read('run-acetone-methanol-semicolon.csv'))
    expect(euro.problems).toEqual([])
    expect(euro.format).toEqual({ delimiter: ';', decimalComma: true, byteOrderMark: true })
    expect(euro.samples.map((s) => [s.label, s.temperatureK, s.liquid])).toEqual(
      plain.samples.map((s) => [s.label, s.temperatureK, s.liquid]),
    )
  })

  it('two-layer run sheet (water/1-butanol): the samples that boiled as two layers carry both layers', () => {
    const p = parseRunFile(read('run-water-1-butanol-two-layers.csv'))
    expect(p.problems).toEqual([])
    expect(p.samples).toHaveLength(12)
    // generated where the published NRTL model splits the liquid at its bubble point (x_water ≥ 0.588)
    expect(p.samples.filter((s) => s.heterogeneous).map((s) => s.label)).toEqual([
      'WB-08',
      'WB-09',
      'WB-10',
      'WB-11',
      'WB-12',
    ])
    for (const s of p.samples) expect([s.upper.length, s.lower.length]).toEqual(s.heterogeneous ? [2, 2] : [0, 0])
  })

  it('pure components and a check standard: exact ends and a check apart from the samples', () => {
    const p = parseRunFile(read('run-acetone-methanol-pure-and-checks.csv'))
    expect(p.problems).toEqual([])
    expect(p.samples.map((s) => [s.label, s.pureComponent])).toEqual([
      ['PURE-ACETONE', 1],
      ['PURE-METHANOL', 2],
      ['AM-21', null],
    ])
    expect(p.checks.map((c) => [c.label, c.knownX1, c.injections.length])).toEqual([['CHK-0.5', 0.5, 2]])
  })
})
