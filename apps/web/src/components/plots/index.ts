/** Ebullio's plots. Import from here; ECharts modules are registered once in echarts-setup.ts. */
export { default as TxyPlot } from './TxyPlot.vue'
export { default as XyPlot } from './XyPlot.vue'
export { default as ResidualPlot } from './ResidualPlot.vue'
export { default as LinePlot } from './LinePlot.vue'
export { default as PlotFrame } from './PlotFrame.vue'
export * from './plot-types'
export { saveFile, showT, tLabel, CURVE_COLOURS } from './plot-style'
export { providePlotTitleBlock, type PlotTitleBlock } from './plot-title-block'
