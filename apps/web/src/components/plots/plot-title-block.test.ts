import { describe, expect, it } from 'vitest'
import { exportOption, stampText, titleBlockLines, TITLE_BLOCK_PX, type PlotTitleBlock } from './plot-title-block'

const block: PlotTitleBlock = {
  system: 'acetone / methanol',
  pressure: '101.33 kPa',
  dataSet: 'Kestrel acetone recycle',
  version: 2,
  state: 'approved',
  signer: 'Dr. Tobias Lindqvist',
  signedAt: '2026-12-03T16:24:26Z',
}

describe('title block of an exported plot', () => {
  it('names the plot, system, pressure, data set and version, approval and signer, and the export date with its zone', () => {
    const lines = titleBlockLines('T–x–y diagram', block, new Date('2026-12-03T17:05:00Z'), 'UTC')
    expect(lines).toEqual([
      'acetone / methanol · T–x–y diagram at 101.33 kPa',
      'Data set "Kestrel acetone recycle" version 2 · approved, signed by Dr. Tobias Lindqvist on 2026-12-03',
      'Exported from Ebullio 2026-12-03 17:05 UTC',
    ])
    expect(
      titleBlockLines('x–y', { ...block, state: 'draft', signer: null, signedAt: null }, new Date(), 'UTC')[1],
    ).toBe('Data set "Kestrel acetone recycle" version 2 · draft, not approved')
    // a title that names the pressure already does not repeat it
    expect(titleBlockLines('T–x–y diagram at 101.33 kPa', block, new Date(), 'UTC')[0]).toBe(
      'acetone / methanol · T–x–y diagram at 101.33 kPa',
    )
    expect(stampText(new Date('2026-12-03T17:05:00Z'), 'Europe/Berlin')).toBe('2026-12-03 18:05 UTC+1')
  })
})

describe('exportOption', () => {
  const option = {
    legend: { top: 4, data: ['Wilson', 'NRTL', 'Liquid x₁'], selected: { Wilson: true, NRTL: false } },
    grid: { top: 52, left: 62 },
    series: [
      { name: 'Wilson', type: 'line' },
      { name: 'NRTL', type: 'line' },
      { name: 'NRTL', type: 'line' },
      { name: 'Liquid x₁', type: 'scatter' },
      { type: 'custom' },
    ],
  }

  it('keeps only the curves shown on screen (both lines of a model hidden by its legend entry go)', () => {
    const o = exportOption(option, null)
    expect((o.series as { name?: string }[]).map((s) => s.name)).toEqual(['Wilson', 'Liquid x₁', undefined])
    expect((o.legend as { data: string[] }[])[0].data).toEqual(['Wilson', 'Liquid x₁'])
    expect((o.grid as { top: number }[])[0].top).toBe(52)
    expect(o.title).toBeUndefined()
  })

  it('puts the title block above a grid and legend moved down by its height', () => {
    const lines = titleBlockLines('T–x–y diagram', block, new Date('2026-12-03T17:05:00Z'), 'UTC')
    const o = exportOption(option, lines)
    expect((o.grid as { top: number }[])[0].top).toBe(52 + TITLE_BLOCK_PX)
    expect((o.legend as { top: number }[])[0].top).toBe(4 + TITLE_BLOCK_PX)
    const t = (o.title as { text: string; subtext: string }[])[0]
    expect(t.text).toBe(lines[0])
    expect(t.subtext).toBe(`${lines[1]}\n${lines[2]}`)
  })
})
