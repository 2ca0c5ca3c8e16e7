import { describe, expect, it } from 'vitest'
import { parseRunFile } from './run-file.js'

const HEADER = 'sample,phase,injection,area_1,area_2,t_boil,t_unit,p_baro,p_unit'

describe('parseRunFile', () => {
  it('gathers liquid and vapour injections per sample and converts T and P to SI', () => {
    const text = [
      HEADER,
      'S01,liquid,1,3000,7000,70.5,C,101.3,kPa',
      'S01,liquid,2,3010,6990,,,,',
      'S01,vapour,1,4500,5500,70.5,C,101.3,kPa',
      'S01,vapour,2,4490,5510,,,,',
    ].join('\n')
    const p = parseRunFile(text)
    expect(p.problems).toEqual([])
    expect(p.samples).toHaveLength(1)
    const s = p.samples[0]
    expect(s.temperatureK).toBeCloseTo(343.65, 10) // 70.5 °C + 273.15 (SI definition of the kelvin)
    expect(s.pressurePa).toBeCloseTo(101300, 6)
    expect(s.liquid.map((i) => i.row)).toEqual([2, 3])
    expect(s.vapour).toHaveLength(2)
    expect(s.rows).toEqual([2, 3, 4, 5])
  })

  it('accepts mmHg, K and short phase names in any case', () => {
    const text = [
      HEADER,
      'S1,L,1,1,1,350,k,760,TORR',
      'S1,V,1,2,1,,,,',
      'S2,liquid,1,1,1,350,K,760,MMHG',
      'S2,Vapor,1,2,1,,,,',
    ].join('\n')
    const p = parseRunFile(text)
    expect(p.problems).toEqual([])
    // 760 Torr = 101325 Pa exactly; 1 mmHg = 133.322387415 Pa (BIPM SI Brochure, 9th ed., 2019, Table 8)
    expect(p.samples[0].pressurePa).toBeCloseTo(101325, 6)
    expect(p.samples[1].pressurePa).toBeCloseTo(760 * 133.322387415, 6)
  })

  it('reads a ;-delimited export with decimal commas and extra columns', () => {
    const text = `Sample;Phase;Injection;Area_1;Area_2;T_boil;T_unit;P_baro;P_unit;Operator\nS1;liquid;1;10,5;20;64,2;C;99,8;kPa;mk\nS1;vapour;1;12;18;;;;;mk\n`
    const p = parseRunFile(text)
    expect(p.problems).toEqual([])
    expect(p.extraColumns).toEqual(['Operator'])
    expect(p.samples[0].liquid[0].area1).toBe(10.5)
    expect(p.samples[0].pressurePa).toBeCloseTo(99800, 6)
  })

  it('lists every problem with row, column, value and message', () => {
    const text = [
      HEADER,
      'S1,liquid,1,-1,10,70,C,101.3,kPa',
      'S1,,1,5,5,,,,',
      'S1,steam,2,5,5,,,,',
      'S2,liquid,1,5,5,900,C,101.3,kPa',
      'S2,vapour,1,5,5,,,,',
      'S3,liquid,1,5,5,70,C,101.3,kPa',
      'S4,liquid,1,5,5,70,C,12,furlong',
      'S4,vapour,1,5,5,71,C,,',
      'S4,vapour,1,5,5,,,,',
    ].join('\n')
    const p = parseRunFile(text)
    expect(p.problems.map((x) => [x.row, x.column, x.value, x.message])).toEqual([
      [2, 'area_1', '-1', 'Peak area cannot be negative.'],
      [3, 'phase', '', 'Phase is missing; use liquid or vapour.'],
      [4, 'phase', 'steam', 'Phase must be liquid, vapour, upper, lower or check.'],
      [5, 't_boil', '900', 'Boiling temperature 1173.15 K is outside the plausible range 150–650 K.'],
      [7, 'phase', 'S3', 'Sample S3 has liquid injections but no vapour injection.'],
      [8, 'p_unit', 'furlong', 'Unknown pressure unit; use Pa, kPa, MPa, bar, mbar, atm, mmHg, torr or psi.'],
      [8, 'p_baro', null, 'Sample S4 has no pressure.'],
      [9, 't_boil', '71', 'Sample S4 has a different temperature on line 8.'],
      [10, 'injection', '1', 'Injection 1 of the vapour of sample S4 appears twice.'],
    ])
    expect(p.samples).toEqual([])
  })

  it('lists every missing required column', () => {
    const p = parseRunFile('sample,phase,area_1,area_2\nS1,liquid,1,1\n')
    expect(p.problems.map((x) => x.message)).toEqual([
      'Required column "injection" is missing.',
      'Required column "t_boil" is missing.',
      'Required column "t_unit" is missing.',
      'Required column "p_baro" is missing.',
      'Required column "p_unit" is missing.',
    ])
  })

  it.each([
    ['an empty file', Buffer.alloc(0), 'The file is empty.'],
    ['a file of blank lines', Buffer.from('\n\r\n  \n'), 'The file is empty.'],
    ['a workbook', Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x14, 0x00, 0x06, 0x00]), /^The file is not a text CSV file/],
    ['UTF-16 without a byte-order mark', Buffer.from(HEADER + '\n', 'utf16le'), /^The file looks like UTF-16/],
    ['Latin-1 bytes', Buffer.from(HEADER + '\nÉ1,liquid,1,1,1,70,C,101,kPa\n', 'latin1'), /^Line 2 holds bytes/],
    ['an unclosed quote', Buffer.from(HEADER + '\n"S1,liquid,1,1,1,70,C,101,kPa\n'), /^Line 2 opens a quoted cell/],
  ])('says once that %s cannot be read, with no missing-column noise', (_what, bytes, message) => {
    const p = parseRunFile(bytes)
    expect(p.problems).toHaveLength(1)
    expect(p.problems[0].message).toMatch(message)
    expect(p.samples).toEqual([])
  })

  it('reads a UTF-16 run sheet that has a byte-order mark', () => {
    const text = [HEADER, 'S1,liquid,1,3000,7000,70.5,C,101.3,kPa', 'S1,vapour,1,4500,5500,,,,'].join('\r\n')
    const p = parseRunFile(Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(text, 'utf16le')]))
    expect(p.problems).toEqual([])
    expect(p.samples[0].temperatureK).toBeCloseTo(343.65, 10)
  })

  describe('two-layer (heterogeneous) samples', () => {
    const H = `${HEADER},layers`

    it('marks a sample with layers = 2 and keeps the overall liquid apart from its upper and lower layers', () => {
      const text = [
        H,
        'B01,liquid,1,3000,7000,93.0,C,101.3,kPa,2',
        'B01,vapour,1,4500,5500,,,,,',
        'B01,upper,1,1500,8500,,,,,2',
        'B01,upper,2,1510,8490,,,,,',
        'B01,lower,1,9000,1000,,,,,',
        'B02,liquid,1,3000,7000,95.0,C,101.3,kPa,1',
        'B02,vapour,1,4500,5500,,,,,',
      ].join('\n')
      const p = parseRunFile(text)
      expect(p.problems).toEqual([])
      const [b1, b2] = p.samples
      expect(b1.heterogeneous).toBe(true)
      expect(b1.liquid.map((i) => i.row)).toEqual([2])
      expect(b1.upper.map((i) => [i.row, i.area1])).toEqual([
        [4, 1500],
        [5, 1510],
      ])
      expect(b1.lower.map((i) => i.row)).toEqual([6])
      expect(b2.heterogeneous).toBe(false)
      expect(b2.upper).toEqual([])
    })

    it('accepts a two-layer sample whose layers were not analysed, and top/bottom for the layers', () => {
      const text = [
        H,
        'B01,liquid,1,3000,7000,93.0,C,101.3,kPa,2',
        'B01,vapour,1,4500,5500,,,,,',
        'B02,liquid,1,3000,7000,93.0,C,101.3,kPa,2',
        'B02,vapour,1,4500,5500,,,,,',
        'B02,TOP,1,1500,8500,,,,,',
        'B02,Bottom,1,9000,1000,,,,,',
      ].join('\n')
      const p = parseRunFile(text)
      expect(p.problems).toEqual([])
      expect(p.samples.map((s) => [s.heterogeneous, s.upper.length, s.lower.length])).toEqual([
        [true, 0, 0],
        [true, 1, 1],
      ])
    })

    it('names the line, column and value of every bad layer entry', () => {
      const text = [
        H,
        'B01,liquid,1,3000,7000,93.0,C,101.3,kPa,two',
        'B01,vapour,1,4500,5500,,,,,',
        'B02,liquid,1,3000,7000,93.0,C,101.3,kPa,2',
        'B02,vapour,1,4500,5500,,,,,1',
        'B03,liquid,1,3000,7000,93.0,C,101.3,kPa,',
        'B03,vapour,1,4500,5500,,,,,',
        'B03,upper,1,1500,8500,,,,,',
        'B04,liquid,1,3000,7000,93.0,C,101.3,kPa,2',
        'B04,vapour,1,4500,5500,,,,,',
        'B04,lower,1,9000,1000,,,,,',
        'B05,liquid,1,3000,7000,93.0,C,101.3,kPa,2',
        'B05,vapour,1,4500,5500,,,,,',
        'B05,upper,1,1500,8500,,,,,',
        'B05,upper,1,1500,8500,,,,,',
        'B05,lower,1,-9000,1000,,,,,',
        'B05,lower,2,9000,1000,,,,,',
      ].join('\n')
      const p = parseRunFile(text)
      expect(p.problems.map((x) => [x.row, x.column, x.value, x.message])).toEqual([
        [2, 'layers', 'two', 'Layers must be 1 or 2 (the number of liquid layers seen in the still).'],
        [5, 'layers', '1', 'Sample B02 has 2 layers on line 4.'],
        [8, 'phase', 'upper', 'Sample B03 has layer injections but is not marked as two-layered; put 2 in layers.'],
        [
          11,
          'phase',
          'lower',
          'Sample B04: the lower layer was analysed but not the upper one; give both layers or neither.',
        ],
        [15, 'injection', '1', 'Injection 1 of the upper layer of sample B05 appears twice.'],
        [16, 'area_1', '-9000', 'Peak area cannot be negative.'],
      ])
      // B01 (no layers read, no layer rows) and B05 (one good lower injection left) still become samples.
      expect(p.samples.map((s) => [s.label, s.heterogeneous, s.upper.length, s.lower.length])).toEqual([
        ['B01', false, 0, 0],
        ['B02', true, 0, 0],
        ['B05', true, 1, 1],
      ])
    })
  })

  describe('pure-component samples', () => {
    it('takes a zero or empty area as the absent component and needs no vapour rows', () => {
      const text = [
        HEADER,
        'P1,liquid,1,5000,0,56.1,C,101.3,kPa',
        'P1,liquid,2,5100,,,,,',
        'P1,vapour,1,5200,0,,,,',
        'P2,liquid,1,0,4000,64.6,C,101.3,kPa',
        'M1,liquid,1,3000,7000,60,C,101.3,kPa',
        'M1,vapour,1,4000,6000,,,,',
      ].join('\n')
      const p = parseRunFile(text)
      expect(p.problems).toEqual([])
      expect(p.samples.map((s) => [s.label, s.pureComponent, s.liquid.length, s.vapour.length])).toEqual([
        ['P1', 1, 2, 1],
        ['P2', 2, 1, 0],
        ['M1', null, 1, 1],
      ])
      expect(p.samples[0].liquid[1].area2).toBe(0)
    })

    it('refuses rows that disagree, two layers on a pure sample, and a row with no peak', () => {
      const text = [
        `${HEADER},layers`,
        'P1,liquid,1,5000,0,56.1,C,101.3,kPa,',
        'P1,liquid,2,0,5000,,,,,',
        'P2,liquid,1,5000,0,56.1,C,101.3,kPa,2',
        'P3,liquid,1,0,0,56.1,C,101.3,kPa,',
        'P4,vapour,1,5000,0,56.1,C,101.3,kPa,',
      ].join('\n')
      const p = parseRunFile(text)
      expect(p.problems.map((x) => [x.row, x.column, x.message])).toEqual([
        [
          2,
          'area_2',
          "Sample P1: line 2 shows only component 1 but line 3 shows only component 2; a pure-component sample has the absent component's area 0 or empty on every row.",
        ],
        [4, 'layers', 'Sample P2 is pure component 1; it cannot have two liquid layers.'],
        [5, 'area_1', 'Both peak areas are zero or empty; a sample holds at least one component.'],
        [6, 'phase', 'Sample P4 has vapour injections but no liquid injection.'],
      ])
      expect(p.samples).toEqual([])
    })
  })

  describe('check standards', () => {
    it('gathers rows of phase check apart from the samples, with their known x1', () => {
      const text = [
        `${HEADER},check_x1`,
        'CS-1,check,1,3000,7000,,,,,0.30',
        'CS-1,Check,2,3010,6990,,,,,',
        'S1,liquid,1,3000,7000,70.5,C,101.3,kPa,',
        'S1,vapour,1,4500,5500,,,,,',
      ].join('\n')
      const p = parseRunFile(text)
      expect(p.problems).toEqual([])
      expect(p.samples.map((s) => s.label)).toEqual(['S1'])
      expect(p.checks).toEqual([
        {
          label: 'CS-1',
          firstRow: 2,
          rows: [2, 3],
          knownX1: 0.3,
          injections: [
            { injection: 1, area1: 3000, area2: 7000, row: 2 },
            { injection: 2, area1: 3010, area2: 6990, row: 3 },
          ],
        },
      ])
    })

    it('refuses a second, different known x1 and a repeated injection', () => {
      const text = [`${HEADER},check_x1`, 'CS-1,check,1,3000,7000,,,,,0.30', 'CS-1,check,1,3000,7000,,,,,0.31'].join(
        '\n',
      )
      const p = parseRunFile(text)
      expect(p.problems.map((x) => [x.row, x.column, x.message])).toEqual([
        [3, 'check_x1', 'Check standard CS-1 has a different x1 on line 2.'],
        [3, 'injection', 'Injection 1 of check standard CS-1 appears twice.'],
      ])
    })
  })
})

describe('parseRunFile for data without vapour compositions (T–x, P–x)', () => {
  const header = 'sample,phase,injection,area_1,area_2,t_boil,t_unit,p_baro,p_unit'
  it('reads liquid-only samples and names a vapour row as out of place', () => {
    const ok = parseRunFile(
      `${header}\nL-1,liquid,1,100,300,50,C,61.2,kPa\nL-1,liquid,2,101,300,,,,\n`,
      undefined,
      undefined,
      {
        liquidOnly: true,
      },
    )
    expect(ok.problems).toEqual([])
    expect(ok.samples.map((s) => [s.label, s.liquid.length, s.vapour.length])).toEqual([['L-1', 2, 0]])
    const bad = parseRunFile(
      `${header}\nL-1,liquid,1,100,300,50,C,61.2,kPa\nL-1,vapour,1,150,250,,,,\n`,
      undefined,
      undefined,
      {
        liquidOnly: true,
      },
    )
    expect(bad.samples).toEqual([])
    expect(bad.problems.map((p) => [p.row, p.column, p.message])).toEqual([
      [
        3,
        'phase',
        'Sample L-1 has vapour injections, but this data set has no vapour composition (T–x or P–x); leave the vapour rows out or choose a T–x–y or P–x–y data set.',
      ],
    ])
    // the same liquid-only file on a T–x–y data set still asks for the vapour
    expect(parseRunFile(`${header}\nL-1,liquid,1,100,300,50,C,61.2,kPa\n`).problems[0].message).toBe(
      'Sample L-1 has liquid injections but no vapour injection.',
    )
  })
})
