/** Shapes the plot components take. Temperatures are always given in kelvin; the unit prop only changes what is shown. */

/** Temperature shown on an axis: kelvin or degrees Celsius. */
export type TemperatureUnit = 'K' | 'C' | 'F'

/** One measured equilibrium state for the T–x–y plot. T in K, compositions as mole fractions of component 1. */
export interface TxyPoint {
  id: string
  /** Boiling temperature, K. */
  T: number
  x1: number
  /** Vapour composition; null when only the liquid was analysed. */
  y1: number | null
  /** Standard uncertainties (same units as the values); omitted or null = no error bar. */
  uT?: number | null
  ux1?: number | null
  uy1?: number | null
  /** Drawn hollow. */
  excluded?: boolean
  /** Drawn with a warning ring and named in the tooltip. */
  outlier?: boolean
  /** Extra tooltip line, e.g. the sample id or the exclusion reason. */
  note?: string
}

/** A fitted (or computed) pair of bubble and dew lines, e.g. thermo's isobaric `PhaseDiagram`. T in K. */
export interface TxyCurve {
  name: string
  x1: number[]
  y1: number[]
  T: number[]
  /** Start hidden (the legend turns it on). */
  hidden?: boolean
}

/** A fitted curve's ±2σ band (thermo's predictionBand): T, Tlow, Thigh in K at each liquid x1; ylow, yhigh the dew side. */
export interface TxyBand {
  name: string
  x1: number[]
  T: number[]
  Tlow: number[]
  Thigh: number[]
  ylow: number[]
  yhigh: number[]
}

/** A liquid composition suggested for the next measurement, with its bubble T (K) and σy before measuring. */
export interface TxySuggestion {
  x1: number
  T: number
  sigmaY: number
  /** predicted vapour composition (drawn on the x–y plot when given) */
  y1?: number
}

/** Pure-component boiling points at the plot's pressure, K (component 1 at x1 = 1, component 2 at x1 = 0). */
export interface PureBoiling {
  T1: number
  T2: number
}

/**
 * An azeotrope to mark: composition and, on the T–x–y plot, temperature in K. For a heterogeneous one x1 is
 * the three-phase vapour and `liquidPhases` the two liquid layers' x1.
 */
export interface AzeotropeMark {
  x1: number
  T?: number
  kind?: 'minimum-boiling' | 'maximum-boiling' | 'heterogeneous'
  liquidPhases?: [number, number]
}

/** The three-phase line of an isobaric diagram (vapour over two liquids): T in K, liquids x1I < x1II, vapour y1. */
export interface ThreePhaseMark {
  T: number
  x1I: number
  x1II: number
  y1: number
}

/** Where two liquids coexist below the three-phase line (the binodal): T ascending, in K. */
export interface TwoLiquidRegion {
  T: number[]
  x1I: number[]
  x1II: number[]
}

/** One x–y curve, e.g. a fitted model at the data set's pressure. */
export interface XyCurve {
  name: string
  x1: number[]
  y1: number[]
  hidden?: boolean
}

/** A measured x–y pair for the x–y plot. */
export interface XyPoint {
  id: string
  x1: number
  y1: number
  excluded?: boolean
}

/** McCabe–Thiele construction to draw on the x–y plot (thermo's `mccabeThiele` result fits it). */
export interface StageConstruction {
  /** Staircase polyline from (xD, xD). */
  staircase: { x: number; y: number }[]
  rectifying: { slope: number; intercept: number }
  stripping: { slope: number; intercept: number }
  intersection: { x: number; y: number } | null
  xF: number
  xD: number
  xB: number
  q: number
  feedStage: number | null
}

/** One residual for the residual plot. */
export interface ResidualPoint {
  id: string
  x1: number
  residual: number
  excluded?: boolean
}

/** A residual series (one per model) with its standard deviation for the ±2σ band. */
export interface ResidualSeries {
  name: string
  points: ResidualPoint[]
  /** Standard deviation of the residuals, same unit as the residuals; omitted = no band. */
  sigma?: number | null
  hidden?: boolean
}

/** A generic line series: x and y arrays of equal length. */
export interface LineSeries {
  name: string
  x: number[]
  y: number[]
  /** Draw markers at each point (e.g. cut boundaries). */
  markers?: boolean
  dashed?: boolean
  /** Put it on the second (right) y axis. */
  rightAxis?: boolean
  hidden?: boolean
  /** Markers only, no line (measured values beside a correlation). */
  scatter?: boolean
}
