export * from './gc-types.js'
export { fitCalibration, REPLICATE_RSD_LIMIT, type FitCalibrationOptions } from './calibration.js'
export { compositionFromAreas, type CompositionFromAreasOptions } from './composition.js'
export {
  ecnResponseFactor,
  effectiveCarbonNumber,
  detectorWarnings,
  ECN_CONTRIBUTIONS,
  type EcnComponent,
  type EcnEstimate,
  type EcnGroup,
  type GcDetector,
} from './ecn.js'
