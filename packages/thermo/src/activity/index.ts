export {
  activityCoefficients,
  excessGibbsOverRT,
  checkActivityModel,
  thermodynamicFactor,
  unstableRange,
} from './activity.js'
