/**
 * γ–φ bubble and dew points: yi·Φi·P = xi·γi·Pi_sat with Φi = φ̂i/(φi_sat·PFi) from the truncated virial
 * equation (pressure-explicit form). ln φ̂1 = (P/RT)·(B11 + y2²·δ12), ln φ̂2 = (P/RT)·(B22 + y1²·δ12),
 * δ12 = 2·B12 − B11 − B22; φi_sat = exp(Bii·Pi_sat/RT); PFi = exp(Vi_L·(P − Pi_sat)/RT)
 * (Smith, Van Ness & Abbott, Introduction to Chemical Engineering Thermodynamics, 7th ed., §11.7 and §14.1;
 * from memory). A Hayden–O'Connell vapour with a carboxylic acid (η or η12 ≥ 4.5) takes φ̂ and φ_sat from the
 * chemical theory of dimerisation instead (chemical-theory.ts). The ideal-vapour path does not pass through this file.
 */
import { lnGammaT } from '../activity/kernel.js'
import { checkMoleFraction, checkPressure, checkTemperature, ThermoError } from '../errors.js'
import { dewPressureCompiled, dewTemperatureCompiled } from '../equilibrium/bubble-dew.js'
import { stabilityOf } from '../equilibrium/stability.js'
import {
  checkDomain,
  compileSystem,
  liquidSplitError,
  noConvergence,
  systemWarnings,
  type CompiledSystem,
} from '../equilibrium/system.js'
import { R, type BinarySystem } from '../types.js'
import { res } from '../equilibrium/kernel.js'
import { chemicalConstants, lnPhiChemical, lnPhiSatChemical, species } from './chemical-theory.js'
import { compiledVirial, solveBubblePGammaPhi, solveBubbleTGammaPhi } from './kernel.js'
import { associationWarnings, secondVirialCoefficients, usesChemicalTheory } from './model.js'
import type { VaporCorrection, VaporModel } from './virial-types.js'

export type VirialVapor = Extract<VaporModel, { kind: 'virial' }>

const cs = new Float64Array(6)
const lnChem = new Float64Array(2)

/**
 * The chemical theory at T, P, y1 for a vapour it applies to (checked and compiled once): ln φ̂ into lnChem,
 * B^F and K into cs. @returns the apparent molar volume, m³/mol.
 */
function chemicalState(vapor: VirialVapor, T: number, P: number, y1: number): number {
  chemicalConstants(compiledVirial(vapor).hoc!, T, cs)
  return lnPhiChemical(cs, T, P, y1, lnChem, 0)
}

/** The true species of a dimerising vapour at one state ({@link vaporSpeciation}). */
export interface VaporSpeciation {
  /** Mole fractions of the true species: monomers 1 and 2, dimers 11, 12 and 22 (they sum to 1). */
  z: { m1: number; m2: number; d11: number; d12: number; d22: number }
  /** Dimerisation constants Kij = zij/(zi·zj·P), 1/Pa. */
  K: { K11: number; K22: number; K12: number }
  /** The free (physical) parts of B, cm³/mol. */
  freeB: { B11: number; B22: number; B12: number }
  /** Apparent moles per mole of true species, 1 + z11 + z12 + z22 (the apparent molar mass over the monomers'). */
  association: number
}

/**
 * The true species of a Hayden–O'Connell vapour with a carboxylic acid at T (K), P (Pa) and apparent y1, by the
 * chemical theory of dimerisation. @throws ThermoError 'invalid-model' for a vapour the chemical theory does not
 * apply to (ideal, Tsonopoulos, or no η or η12 ≥ 4.5), 'invalid-input' for a bad T, P or y1.
 */
export function vaporSpeciation(vapor: VaporModel, T: number, P: number, y1: number): VaporSpeciation {
  if (!usesChemicalTheory(vapor))
    throw new ThermoError(
      'invalid-model',
      "Speciation needs a Hayden–O'Connell vapour with a carboxylic acid (η or η12 of at least 4.5).",
    )
  checkTemperature(T)
  checkPressure(P)
  checkMoleFraction(y1, 'y1')
  chemicalState(vapor as VirialVapor, T, P, y1)
  const [m1, m2, d11, d12, d22] = species
  return {
    z: { m1, m2, d11, d12, d22 },
    K: { K11: cs[3], K22: cs[4], K12: cs[5] },
    freeB: { B11: 1e6 * cs[0], B22: 1e6 * cs[1], B12: 1e6 * cs[2] },
    association: 1 + d11 + d12 + d22,
  }
}

/**
 * Vapour-phase correction factors at T (K), P (Pa), vapour y1, with the pure vapour pressures psat (Pa): the
 * truncated virial equation, or the chemical theory for a Hayden–O'Connell vapour with a carboxylic acid.
 */
export function vaporCorrection(
  vapor: VaporModel,
  T: number,
  P: number,
  y1: number,
  psat: [number, number],
): VaporCorrection {
  if (vapor.kind !== 'virial') return { phi: [1, 1], phiSat: [1, 1], poynting: [1, 1], Phi: [1, 1] }
  const rt = R * T
  let phi1: number
  let phi2: number
  let s1: number
  let s2: number
  if (usesChemicalTheory(vapor)) {
    chemicalState(vapor, T, P, y1)
    phi1 = Math.exp(lnChem[0])
    phi2 = Math.exp(lnChem[1])
    s1 = Math.exp(lnPhiSatChemical(cs, T, 0, psat[0]))
    s2 = Math.exp(lnPhiSatChemical(cs, T, 1, psat[1]))
  } else {
    const { B11, B22, B12 } = secondVirialCoefficients(vapor, T)
    const d12 = 2 * B12 - B11 - B22
    const y2 = 1 - y1
    // B in cm³/mol → m³/mol (1e-6) so that B·P/RT is dimensionless.
    phi1 = Math.exp((1e-6 * P * (B11 + y2 * y2 * d12)) / rt)
    phi2 = Math.exp((1e-6 * P * (B22 + y1 * y1 * d12)) / rt)
    s1 = Math.exp((1e-6 * B11 * psat[0]) / rt)
    s2 = Math.exp((1e-6 * B22 * psat[1]) / rt)
  }
  let pf1 = 1
  let pf2 = 1
  if (vapor.poynting) {
    pf1 = Math.exp((1e-6 * vapor.components[0].liquidMolarVolume! * (P - psat[0])) / rt)
    pf2 = Math.exp((1e-6 * vapor.components[1].liquidMolarVolume! * (P - psat[1])) / rt)
  }
  return { phi: [phi1, phi2], phiSat: [s1, s2], poynting: [pf1, pf2], Phi: [phi1 / (s1 * pf1), phi2 / (s2 * pf2)] }
}

/**
 * Warnings when the virial equation truncated after B is doubtful: the vapour's reduced density exceeds half the
 * critical density (Prausnitz, Lichtenthaler & de Azevedo, Molecular Thermodynamics of Fluid-Phase Equilibria,
 * 3rd ed., ch. 5; from memory), or Z = 1 + B·P/RT falls below 0.5 (the vapour is far from the dilute gas the
 * truncated form describes: strong association). A Hayden–O'Connell vapour with a carboxylic acid always carries
 * the statement that the chemical theory ran ({@link associationWarnings}), and the density check applies to its
 * physical part (the free B in the truncated virial equation): per apparent mole, V = RT/(P·(1 + zD)) + B^F_mix.
 */
export function virialValidityWarnings(vapor: VaporModel, T: number, P: number, y1: number): string[] {
  if (vapor.kind !== 'virial') return []
  if (usesChemicalTheory(vapor)) return chemicalValidityWarnings(vapor, T, P, y1)
  const { B11, B22, B12 } = secondVirialCoefficients(vapor, T)
  const y2 = 1 - y1
  const B = y1 * y1 * B11 + 2 * y1 * y2 * B12 + y2 * y2 * B22
  const RTP = (R * T * 1e6) / P // cm³/mol
  const V = RTP + B
  const Vc = y1 * vapor.components[0].Vc + y2 * vapor.components[1].Vc
  const out = associationWarnings(vapor)
  if (!(V > 0 && Vc / V <= 0.5))
    out.push(
      `The vapour at ${T.toFixed(2)} K and ${(P / 1000).toPrecision(4)} kPa is denser than half its critical density; the virial equation truncated after B is doubtful there.`,
    )
  if (1 + B / RTP < 0.5)
    out.push(
      `At ${T.toFixed(2)} K and ${(P / 1000).toPrecision(4)} kPa the truncated virial equation gives Z = ${(1 + B / RTP).toFixed(2)}; so strong a non-ideality (association) is outside what it describes, and the fugacity coefficients are doubtful there.`,
    )
  return out
}

/** {@link virialValidityWarnings} under the chemical theory: the statement, and the density of its physical part. */
function chemicalValidityWarnings(vapor: VirialVapor, T: number, P: number, y1: number): string[] {
  const V = 1e6 * chemicalState(vapor, T, P, y1) // cm³ per apparent mole
  const Vc = y1 * vapor.components[0].Vc + (1 - y1) * vapor.components[1].Vc
  const out = associationWarnings(vapor)
  if (!(V > 0 && Vc / V <= 0.5))
    out.push(
      `The vapour at ${T.toFixed(2)} K and ${(P / 1000).toPrecision(4)} kPa is denser than half its critical density; the physical part of the chemical theory (the virial equation truncated after the free B) is doubtful there.`,
    )
  return out
}

const g = new Float64Array(4)

/** γ–φ results are single-liquid: refuse (liquid-split) when the liquid x1 lies in a two-liquid gap at T. */
function assertSingleLiquid(c: CompiledSystem, x1: number, T: number): void {
  const s = stabilityOf(c.act)
  if (!s.maySplit(T)) return
  if (s.gaps(T).some((gap) => x1 > gap.xI && x1 < gap.xII)) throw liquidSplitError(c, x1, T)
}
const phiBuf = new Float64Array(5)
function psatOf(c: CompiledSystem, T: number): [number, number] {
  return [Math.exp(c.vp1.a - c.vp1.b / (T + c.vp1.c)), Math.exp(c.vp2.a - c.vp2.b / (T + c.vp2.c))]
}

function virialOf(system: BinarySystem, vapor?: VaporModel): VirialVapor {
  const v = vapor ?? system?.vapor
  if (!v || v.kind !== 'virial')
    throw new ThermoError('invalid-model', 'A γ–φ calculation needs a virial vapour model.')
  compiledVirial(v) // checks the model once (then cached)
  return v
}

/** Result of a γ–φ bubble or dew point: the usual fields plus the vapour fugacity coefficients φ̂ = [φ̂1, φ̂2]. */
export interface GammaPhiResult {
  converged: true
  T: number
  P: number
  x1: number
  y1: number
  gamma: [number, number]
  phi: [number, number]
  Phi: [number, number]
  iterations: number
  warnings: string[]
}

/**
 * The result at a settled state of the substitution solvers (bubble pressure, dew temperature): refuses a liquid in a
 * two-liquid gap, then γ, φ̂ and Φ at that state. `z1` is the composition that sets the range warnings.
 */
function settled(
  c: CompiledSystem,
  v: VirialVapor,
  s: { T: number; P: number; x1: number; y1: number },
  iterations: number,
  z1: number,
): GammaPhiResult {
  assertSingleLiquid(c, s.x1, s.T)
  lnGammaT(c.act, s.x1, s.T, g)
  const fin = vaporCorrection(v, s.T, s.P, s.y1, psatOf(c, s.T))
  return {
    converged: true,
    ...s,
    gamma: [Math.exp(g[0]), Math.exp(g[1])],
    phi: fin.phi,
    Phi: fin.Phi,
    iterations,
    warnings: [...systemWarnings(c, s.T, z1), ...virialValidityWarnings(v, s.T, s.P, s.y1)],
  }
}

/** The checked virial model and the compiled system of a public γ–φ call. */
function prepare(system: BinarySystem, vapor?: VaporModel): { c: CompiledSystem; v: VirialVapor } {
  const v = virialOf(system, vapor)
  const c = compileSystem(system)
  // compileSystem returns a fresh object: set the vapour given here (it may differ from system.vapor).
  if (c.source.vapor !== v) c.gv = compiledVirial(v)
  return { c, v }
}

/**
 * γ–φ bubble temperature at P (Pa) and liquid x1: Newton on ln Σ xi·γi·Pi_sat/Φi − ln P with Φ carried from the
 * last iterate (Φ changes slowly with T), stopped when T moves less than 1e-9 K and y1 less than 1e-12.
 */
export function bubbleTemperatureGammaPhi(
  system: BinarySystem,
  at: { P: number; x1: number },
  vapor?: VaporModel,
): GammaPhiResult {
  const { c, v } = prepare(system, vapor)
  checkPressure(at.P)
  checkMoleFraction(at.x1, 'x1')
  return bubbleTemperatureGammaPhiCompiled(c, v, at.P, at.x1)
}

/** {@link bubbleTemperatureGammaPhi} on a checked system whose `gv` is the compiled form of `v`. */
export function bubbleTemperatureGammaPhiCompiled(
  c: CompiledSystem,
  v: VirialVapor,
  P: number,
  x1: number,
): GammaPhiResult {
  if (solveBubbleTGammaPhi(c, c.gv!, Math.log(P), x1, phiBuf)) {
    const T = res[0]
    const y1 = res[1]
    const gamma1 = res[2]
    const gamma2 = res[3]
    const iterations = res[4]
    assertSingleLiquid(c, x1, T)
    const Vc = 1e-6 * (y1 * v.components[0].Vc + (1 - y1) * v.components[1].Vc)
    const sw = systemWarnings(c, T, x1)
    return {
      converged: true,
      T,
      P,
      x1,
      y1,
      gamma: [gamma1, gamma2],
      phi: [phiBuf[0], phiBuf[1]],
      Phi: [phiBuf[2], phiBuf[3]],
      iterations,
      // the common case (dilute, non-associating vapour) skips the full check
      warnings:
        phiBuf[4] > 0 && Vc / phiBuf[4] <= 0.5 && phiBuf[4] > (0.5 * R * T) / P && c.gv!.hoc === null
          ? sw
          : [...sw, ...virialValidityWarnings(v, T, P, y1)],
    }
  }
  throw noConvergence('γ–φ bubble-temperature', `x1 = ${x1} and ${P} Pa`)
}

/** γ–φ bubble pressure at T (K) and liquid x1, by substitution on P and y (converges in a few steps below ~1 MPa). */
export function bubblePressureGammaPhi(
  system: BinarySystem,
  at: { T: number; x1: number },
  vapor?: VaporModel,
): GammaPhiResult {
  const { c, v } = prepare(system, vapor)
  checkTemperature(at.T)
  checkMoleFraction(at.x1, 'x1')
  return bubblePressureGammaPhiCompiled(c, v, at.T, at.x1)
}

/** {@link bubblePressureGammaPhi} on a checked system whose `gv` is the compiled form of `v`. */
export function bubblePressureGammaPhiCompiled(
  c: CompiledSystem,
  v: VirialVapor,
  T: number,
  x1: number,
): GammaPhiResult {
  checkDomain(c, T)
  if (!solveBubblePGammaPhi(c, c.gv!, T, x1, phiBuf))
    throw noConvergence('γ–φ bubble-pressure', `x1 = ${x1} and ${T} K`)
  return settled(c, v, { T, P: res[5], x1, y1: res[1] }, res[4], x1)
}

/** γ–φ dew temperature at P (Pa) and vapour y1: Newton on T with the liquid composition updated by substitution. */
export function dewTemperatureGammaPhi(
  system: BinarySystem,
  at: { P: number; y1: number },
  vapor?: VaporModel,
): GammaPhiResult {
  const { c, v } = prepare(system, vapor)
  checkPressure(at.P)
  checkMoleFraction(at.y1, 'y1')
  return dewTemperatureGammaPhiCompiled(c, v, at.P, at.y1)
}

/** {@link dewTemperatureGammaPhi} on a checked system. */
export function dewTemperatureGammaPhiCompiled(
  c: CompiledSystem,
  v: VirialVapor,
  P: number,
  y1: number,
): GammaPhiResult {
  const y2 = 1 - y1
  const start = dewTemperatureCompiled(c, P, y1)
  let T = start.T
  let x1 = start.x1
  for (let it = 1; it <= 300; it++) {
    lnGammaT(c.act, x1, T, g)
    const ps = psatOf(c, T)
    const corr = vaporCorrection(v, T, P, y1, ps)
    const q1 = y1 > 0 ? (y1 * corr.Phi[0] * P) / (Math.exp(g[0]) * ps[0]) : 0
    const q2 = y2 > 0 ? (y2 * corr.Phi[1] * P) / (Math.exp(g[1]) * ps[1]) : 0
    const Q = q1 + q2
    const d1 = T + c.vp1.c
    const d2 = T + c.vp2.c
    const fp = -(q1 * (g[2] + c.vp1.b / (d1 * d1)) + q2 * (g[3] + c.vp2.b / (d2 * d2))) / Q
    const dT = -Math.log(Q) / fp
    const xn = q1 / Q
    const dx = Math.abs(xn - x1)
    x1 = xn
    if (!Number.isFinite(dT)) break
    T += Math.max(-20, Math.min(20, dT))
    if (Math.abs(dT) < 1e-9 && dx < 1e-12) return settled(c, v, { T, P, x1, y1 }, it, y1)
  }
  throw noConvergence('γ–φ dew-temperature', `y1 = ${y1} and ${P} Pa`)
}

/** γ–φ dew pressure at T (K) and vapour y1: substitution on P and the liquid composition from the ideal-vapour dew point. */
export function dewPressureGammaPhi(
  system: BinarySystem,
  at: { T: number; y1: number },
  vapor?: VaporModel,
): GammaPhiResult {
  const { c, v } = prepare(system, vapor)
  checkTemperature(at.T)
  checkMoleFraction(at.y1, 'y1')
  return dewPressureGammaPhiCompiled(c, v, at.T, at.y1)
}

/** {@link dewPressureGammaPhi} on a checked system. */
export function dewPressureGammaPhiCompiled(c: CompiledSystem, v: VirialVapor, T: number, y1: number): GammaPhiResult {
  checkDomain(c, T)
  const y2 = 1 - y1
  const start = dewPressureCompiled(c, T, y1)
  let P = start.P
  let x1 = start.x1
  const ps = psatOf(c, T)
  for (let it = 1; it <= 300; it++) {
    lnGammaT(c.act, x1, T, g)
    const corr = vaporCorrection(v, T, P, y1, ps)
    const q1 = y1 > 0 ? (y1 * corr.Phi[0]) / (Math.exp(g[0]) * ps[0]) : 0
    const q2 = y2 > 0 ? (y2 * corr.Phi[1]) / (Math.exp(g[1]) * ps[1]) : 0
    const Pn = 1 / (q1 + q2)
    const xn = q1 * Pn
    const done = Math.abs(Pn - P) < 1e-11 * Pn && Math.abs(xn - x1) < 1e-12
    P = Pn
    x1 = xn
    if (!Number.isFinite(P)) break
    if (done) return settled(c, v, { T, P, x1, y1 }, it, y1)
  }
  throw noConvergence('γ–φ dew-pressure', `y1 = ${y1} and ${T} K`)
}
