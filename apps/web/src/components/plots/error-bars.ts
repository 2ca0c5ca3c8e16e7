/** Error bars as an ECharts custom series: ECharts has no error-bar series of its own. */
import { MUTED } from './plot-style'

/** One bar: centre (x, y) and half-widths in axis units (0 = no bar in that direction). */
export type ErrorBarDatum = [x: number, y: number, halfX: number, halfY: number]

const CAP = 3 // px, half the width of the little end caps

/**
 * A silent custom series drawing horizontal and vertical bars with caps.
 * @param name give it the name of the point series it belongs to, so one legend entry toggles both.
 */
export function errorBarSeries(name: string, data: ErrorBarDatum[], colour = MUTED): Record<string, unknown> {
  return {
    type: 'custom',
    name,
    silent: true,
    color: colour,
    z: 1,
    encode: { x: 0, y: 1 },
    data,
    renderItem: (
      _params: unknown,
      api: { value: (i: number) => number; coord: (v: number[]) => number[]; style: (o?: object) => object },
    ) => {
      const x = api.value(0)
      const y = api.value(1)
      const hx = api.value(2)
      const hy = api.value(3)
      const style = { stroke: colour, lineWidth: 1 }
      const children: object[] = []
      const seg = (a: number[], b: number[]) =>
        children.push({ type: 'line', shape: { x1: a[0], y1: a[1], x2: b[0], y2: b[1] }, style })
      if (hx > 0) {
        const l = api.coord([x - hx, y])
        const r = api.coord([x + hx, y])
        seg(l, r)
        seg([l[0], l[1] - CAP], [l[0], l[1] + CAP])
        seg([r[0], r[1] - CAP], [r[0], r[1] + CAP])
      }
      if (hy > 0) {
        const lo = api.coord([x, y - hy])
        const hi = api.coord([x, y + hy])
        seg(lo, hi)
        seg([lo[0] - CAP, lo[1]], [lo[0] + CAP, lo[1]])
        seg([hi[0] - CAP, hi[1]], [hi[0] + CAP, hi[1]])
      }
      return { type: 'group', children }
    },
  }
}
