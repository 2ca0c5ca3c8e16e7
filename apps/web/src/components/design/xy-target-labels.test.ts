import { describe, expect, it } from 'vitest'
import { xyOption } from '../plots/xy-option'

// The engineer's x–y plot writes the targets as the screens write the symbols (x_D, x_F, x_B), never the engine's keys.
describe('x–y target labels', () => {
  it('labels the distillate, feed and bottoms targets x_D, x_F and x_B', () => {
    const o = xyOption({
      title: 't',
      curves: [],
      points: [],
      targets: { xD: 0.95, xF: 0.5, xB: 0.05 },
      names: ['acetone', 'methanol'],
    })
    const targets = (o.series as { name: string; data?: { name: string }[] }[]).find((s) => s.name === 'Targets')!
    expect(targets.data!.map((d) => d.name)).toEqual(['x_D = 0.950', 'x_F = 0.500', 'x_B = 0.050'])
  })
})
