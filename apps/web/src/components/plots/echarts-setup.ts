/**
 * The one place ECharts modules are registered. Only what Ebullio's plots draw is pulled in, so
 * the pages that show no plot (sign-in, people) never load ECharts at all: plots are reached
 * through lazily loaded views only.
 */
import { LineChart, ScatterChart, CustomChart } from 'echarts/charts'
import {
  AriaComponent,
  GraphicComponent,
  GridComponent,
  LegendComponent,
  MarkAreaComponent,
  MarkLineComponent,
  MarkPointComponent,
  TitleComponent,
  TooltipComponent,
} from 'echarts/components'
import { use } from 'echarts/core'
import { CanvasRenderer, SVGRenderer } from 'echarts/renderers'

use([
  CanvasRenderer,
  SVGRenderer,
  LineChart,
  ScatterChart,
  CustomChart,
  GridComponent,
  TooltipComponent,
  LegendComponent,
  MarkLineComponent,
  MarkPointComponent,
  MarkAreaComponent,
  AriaComponent,
  TitleComponent,
  GraphicComponent,
])

export { init } from 'echarts/core'
export type { EChartsCoreOption } from 'echarts/core'
