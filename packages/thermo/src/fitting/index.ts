export { fitBinary } from './fit-binary.js'
export type {
  FitBinaryOptions,
  FitBinaryResult,
  FitObjective,
  FitVaporModel,
  FittedParameter,
  PointResidual,
} from './fit-binary.js'
export type { BinaryPoint } from './fit-input.js'
export { DEFAULT_SIGMA_P, DEFAULT_SIGMA_T, DEFAULT_SIGMA_Y } from './fit-input.js'
export type { FittableModel, UniquacStructure } from './parameters.js'
export { predictionBand, predictionBandIsothermal } from './prediction.js'
export { planNextMeasurements, suggestNextCompositions } from './next-measurements.js'
export type { PredictionBand, PredictionBandIsothermal } from './prediction.js'
export type {
  NextMeasurementPlan,
  NextMeasurementOptions,
  SuggestedComposition,
  SuggestionCriterion,
} from './next-measurements.js'
export { NRTL_ALPHA_BOUNDS } from './alpha-bounds.js'
export { OUTLIER_RULE, outlierPointIds, rootMeanSquare } from './outliers.js'
export type { OutlierResidual } from './outliers.js'
export type { NamedFitWarning } from './liquid-split.js'
export { fitJoint } from './joint-fit.js'
export type { JointFitOptions, JointFitResult, JointDataSetStatistics, JointFitMember } from './joint-fit.js'
export { studentTQuantile, studentT975 } from './student-t.js'
