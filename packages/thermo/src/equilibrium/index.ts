export { bubbleTemperature, bubblePressure, dewTemperature, dewPressure } from './bubble-dew.js'
export { relativeVolatility, findAzeotrope, phaseDiagram } from './diagram.js'
export type { DiagramCondition } from './diagram.js'
