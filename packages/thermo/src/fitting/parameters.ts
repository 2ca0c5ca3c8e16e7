/**
 * How each fittable activity model maps to a parameter vector: names (the model's own field names),
 * typical scales (for finite-difference steps and starting grids) and validity limits.
 */
import { R, type ActivityModel } from '../types.js'
import { nrtlTauGradient, T_REF } from '../activity/kernel.js'
import { NRTL_ALPHA_BOUNDS } from './alpha-bounds.js'

/** The models fitBinary can fit. */
export type FittableModel = 'margules' | 'van-laar' | 'wilson' | 'nrtl' | 'uniquac'

/** UNIQUAC's pure-component structure parameters (volume r and area q), dimensionless. */
export interface UniquacStructure {
  r1: number
  r2: number
  q1: number
  q2: number
}

/** A parameter layout: build a model from p, say whether p is allowed, and where to start. */
export interface ParameterLayout {
  names: string[]
  scales: number[]
  build(p: ArrayLike<number>): ActivityModel
  valid(p: ArrayLike<number>): boolean
  starts: number[][]
  /**
   * Analytic ∂ln γ1/∂θj, ∂ln γ2/∂θj of `model` (built from p) at x1 and T into out[2j], out[2j + 1], where the
   * layout has it (NRTL with α held); otherwise the fits use forward differences.
   */
  gradient?(model: ActivityModel, x1: number, T: number, out: Float64Array): void
}

const tau = new Float64Array(4)

/** NRTL (α held) gradient in (b12, b21) and, when `withSlopes`, (b12T, b21T): ∂τ/∂b = 1/RT, ∂τ/∂bT = (T − 298.15 K)/RT. */
function nrtlGradient(withSlopes: boolean) {
  return (model: ActivityModel, x1: number, T: number, out: Float64Array): void => {
    nrtlTauGradient(model as Extract<ActivityModel, { kind: 'nrtl' }>, x1, T, tau)
    const k = 1 / (R * T)
    out[0] = tau[0] * k
    out[1] = tau[1] * k
    out[2] = tau[2] * k
    out[3] = tau[3] * k
    if (!withSlopes) return
    const s = (T - T_REF) * k
    out[4] = tau[0] * s
    out[5] = tau[1] * s
    out[6] = tau[2] * s
    out[7] = tau[3] * s
  }
}

const ENERGY_GRID = [-1500, 0, 1500, 4000]
const DIMENSIONLESS_GRID = [-0.5, 0.5, 1.5, 3]

function grid(values: number[]): number[][] {
  return values.flatMap((a) => values.map((b) => [a, b]))
}

/** Layout for a model; V1, V2 (cm³/mol) for Wilson; alpha the NRTL α (fixed unless fitAlpha); r, q for UNIQUAC. */
export function parameterLayout(
  model: FittableModel,
  opts: {
    V1?: number
    V2?: number
    alpha: number
    fitAlpha: boolean
    uniquac?: UniquacStructure
    temperatureDependent?: boolean
  },
): ParameterLayout {
  if (opts.temperatureDependent && (model === 'nrtl' || model === 'wilson' || model === 'uniquac'))
    return temperatureDependentLayout(model, opts)
  switch (model) {
    case 'uniquac': {
      const rq = opts.uniquac as UniquacStructure
      return {
        names: ['a12', 'a21'],
        scales: [100, 100],
        build: (p) => ({ kind: 'uniquac', a12: p[0], a21: p[1], ...rq }),
        valid: (p) => Math.abs(p[0]) < 1e5 && Math.abs(p[1]) < 1e5,
        starts: grid(ENERGY_GRID),
      }
    }
    case 'margules':
      return {
        names: ['A12', 'A21'],
        scales: [1, 1],
        build: (p) => ({ kind: 'margules', A12: p[0], A21: p[1] }),
        valid: (p) => Math.abs(p[0]) < 50 && Math.abs(p[1]) < 50,
        starts: grid(DIMENSIONLESS_GRID),
      }
    case 'van-laar':
      return {
        names: ['A12', 'A21'],
        scales: [1, 1],
        build: (p) => ({ kind: 'van-laar', A12: p[0], A21: p[1] }),
        // Van Laar needs A12 and A21 of one sign; both near zero is the ideal limit.
        valid: (p) => p[0] * p[1] > 0 && Math.abs(p[0]) < 50 && Math.abs(p[1]) < 50,
        starts: [
          [0.5, 0.5],
          [1, 2],
          [2, 1],
          [2.5, 2.5],
          [-0.5, -0.5],
          [-1, -2],
          [-2, -1],
        ],
      }
    case 'wilson': {
      const V1 = opts.V1 as number
      const V2 = opts.V2 as number
      return {
        names: ['a12', 'a21'],
        scales: [100, 100],
        build: (p) => ({ kind: 'wilson', a12: p[0], a21: p[1], V1, V2 }),
        valid: (p) => Math.abs(p[0]) < 1e5 && Math.abs(p[1]) < 1e5,
        starts: grid(ENERGY_GRID),
      }
    }
    case 'nrtl': {
      const alpha = opts.alpha
      if (opts.fitAlpha) {
        return {
          names: ['b12', 'b21', 'alpha'],
          scales: [100, 100, 0.01],
          build: (p) => ({ kind: 'nrtl', b12: p[0], b21: p[1], alpha: p[2] }),
          valid: (p) =>
            Math.abs(p[0]) < 1e5 &&
            Math.abs(p[1]) < 1e5 &&
            p[2] >= NRTL_ALPHA_BOUNDS[0] &&
            p[2] <= NRTL_ALPHA_BOUNDS[1],
          starts: grid(ENERGY_GRID).map(([a, b]) => [a, b, alpha]),
        }
      }
      return {
        names: ['b12', 'b21'],
        scales: [100, 100],
        build: (p) => ({ kind: 'nrtl', b12: p[0], b21: p[1], alpha }),
        valid: (p) => Math.abs(p[0]) < 1e5 && Math.abs(p[1]) < 1e5,
        starts: grid(ENERGY_GRID),
        gradient: nrtlGradient(false),
      }
    }
  }
}

/**
 * Temperature-dependent NRTL (b12, b21, b12T, b21T), Wilson or UNIQUAC (a12, a21, a12T, a21T) energies,
 * b(T) = b + bT·(T − 298.15 K); bT in J/(mol·K). NRTL α is held (not fitted) in this layout.
 */
function temperatureDependentLayout(
  model: 'nrtl' | 'wilson' | 'uniquac',
  opts: { V1?: number; V2?: number; alpha: number; uniquac?: UniquacStructure },
): ParameterLayout {
  const starts = grid(ENERGY_GRID).map(([a, b]) => [a, b, 0, 0])
  const valid = (p: ArrayLike<number>) =>
    Math.abs(p[0]) < 1e5 && Math.abs(p[1]) < 1e5 && Math.abs(p[2]) < 1e3 && Math.abs(p[3]) < 1e3
  if (model === 'nrtl') {
    const alpha = opts.alpha
    return {
      names: ['b12', 'b21', 'b12T', 'b21T'],
      scales: [100, 100, 1, 1],
      build: (p) => ({ kind: 'nrtl', b12: p[0], b21: p[1], alpha, b12T: p[2], b21T: p[3] }),
      valid,
      starts,
      gradient: nrtlGradient(true),
    }
  }
  if (model === 'uniquac') {
    const rq = opts.uniquac as UniquacStructure
    return {
      names: ['a12', 'a21', 'a12T', 'a21T'],
      scales: [100, 100, 1, 1],
      build: (p) => ({ kind: 'uniquac', a12: p[0], a21: p[1], ...rq, a12T: p[2], a21T: p[3] }),
      valid,
      starts,
    }
  }
  const V1 = opts.V1 as number
  const V2 = opts.V2 as number
  return {
    names: ['a12', 'a21', 'a12T', 'a21T'],
    scales: [100, 100, 1, 1],
    build: (p) => ({ kind: 'wilson', a12: p[0], a21: p[1], V1, V2, a12T: p[2], a21T: p[3] }),
    valid,
    starts,
  }
}
