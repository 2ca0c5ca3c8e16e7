export {
  sydneyYoungCorrection,
  SYDNEY_YOUNG_C_ASSOCIATED,
  SYDNEY_YOUNG_C_NON_ASSOCIATED,
  type SydneyYoungResult,
} from './sydney-young.js'
