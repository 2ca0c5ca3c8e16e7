export * from './control-chart.js'
