export {
  equilibriumCurve,
  type EquilibriumCurve,
  type EquilibriumSource,
  type EquilibriumTableRow,
} from './equilibrium-curve.js'
export { DESIGN_CAUTION } from './design-notes.js'
export { fenske, type FenskeResult } from './fenske.js'
export { minimumReflux, type MinimumRefluxResult } from './minimum-reflux.js'
export {
  mccabeThiele,
  MAX_STAGES,
  type McCabeThieleResult,
  type McCabeThieleSpec,
  type OperatingLine,
  type RefluxSpec,
  type StagePoint,
} from './mccabe-thiele.js'
