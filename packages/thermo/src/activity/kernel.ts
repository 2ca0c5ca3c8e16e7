/**
 * The hot path of every solver: ln γ1, ln γ2 and their temperature derivatives, written into a
 * caller's buffer so nothing is allocated per call. Formulas: Smith, Van Ness & Abbott, Introduction
 * to Chemical Engineering Thermodynamics, 7th ed., §12.1–12.2 (Margules, Van Laar, Wilson, NRTL);
 * UNIQUAC after Abrams & Prausnitz, AIChE J. 21 (1975) 116, with z = 10.
 * The T-derivatives are analytic (checked against finite differences in kernel.test.ts).
 */
import { R, type ActivityModel } from '../types.js'

/** out[0] = ln γ1, out[1] = ln γ2, out[2] = ∂ln γ1/∂T, out[3] = ∂ln γ2/∂T (1/K), at x1 and T (K). */
/** Reference temperature of temperature-dependent interaction energies, K. */
export const T_REF = 298.15

export function lnGammaT(model: ActivityModel, x1: number, T: number, out: Float64Array): void {
  const x2 = 1 - x1
  switch (model.kind) {
    case 'ideal':
      out[0] = 0
      out[1] = 0
      out[2] = 0
      out[3] = 0
      return
    case 'margules': {
      const { A12, A21 } = model
      out[0] = x2 * x2 * (A12 + 2 * (A21 - A12) * x1)
      out[1] = x1 * x1 * (A21 + 2 * (A12 - A21) * x2)
      out[2] = 0
      out[3] = 0
      return
    }
    case 'van-laar': {
      const { A12, A21 } = model
      const d = A12 * x1 + A21 * x2
      if (d === 0) {
        out[0] = 0
        out[1] = 0
      } else {
        const f1 = (A21 * x2) / d
        const f2 = (A12 * x1) / d
        out[0] = A12 * f1 * f1
        out[1] = A21 * f2 * f2
      }
      out[2] = 0
      out[3] = 0
      return
    }
    case 'wilson':
      return wilson(model, x1, x2, T, out)
    case 'nrtl':
      return nrtl(model, x1, x2, T, out)
    case 'uniquac':
      return uniquac(model, x1, x2, T, out)
  }
}

function wilson(
  m: Extract<ActivityModel, { kind: 'wilson' }>,
  x1: number,
  x2: number,
  T: number,
  out: Float64Array,
): void {
  const RT = R * T
  // Temperature-dependent energies a(T) = a + aT·(T − 298.15 K) when aT is given (0 otherwise).
  const a12T = m.a12T ?? 0
  const a21T = m.a21T ?? 0
  const a12 = m.a12 + a12T * (T - T_REF)
  const a21 = m.a21 + a21T * (T - T_REF)
  const L12 = (m.V2 / m.V1) * Math.exp(-a12 / RT)
  const L21 = (m.V1 / m.V2) * Math.exp(-a21 / RT)
  // d/dT of −a(T)/RT = a/(RT·T) − aT/RT
  const dL12 = L12 * (a12 / (RT * T) - a12T / RT)
  const dL21 = L21 * (a21 / (RT * T) - a21T / RT)
  const D1 = x1 + L12 * x2
  const D2 = x2 + L21 * x1
  const c = L12 / D1 - L21 / D2
  out[0] = -Math.log(D1) + x2 * c
  out[1] = -Math.log(D2) - x1 * c
  const dc = (dL12 * x1) / (D1 * D1) - (dL21 * x2) / (D2 * D2)
  out[2] = (-x2 * dL12) / D1 + x2 * dc
  out[3] = (-x1 * dL21) / D2 - x1 * dc
}

function nrtl(m: Extract<ActivityModel, { kind: 'nrtl' }>, x1: number, x2: number, T: number, out: Float64Array): void {
  const RT = R * T
  // Temperature-dependent energies b(T) = b + bT·(T − 298.15 K) when bT is given (0 otherwise).
  const b12T = m.b12T ?? 0
  const b21T = m.b21T ?? 0
  const t12 = (m.b12 + b12T * (T - T_REF)) / RT
  const t21 = (m.b21 + b21T * (T - T_REF)) / RT
  const G12 = Math.exp(-m.alpha * t12)
  const G21 = Math.exp(-m.alpha * t21)
  // dτ/dT = bT/RT − τ/T, dG/dT = −α·G·dτ/dT
  const dt12 = b12T / RT - t12 / T
  const dt21 = b21T / RT - t21 / T
  const dG12 = -m.alpha * G12 * dt12
  const dG21 = -m.alpha * G21 * dt21
  const S1 = x1 + x2 * G21
  const S2 = x2 + x1 * G12
  const dS1 = x2 * dG21
  const dS2 = x1 * dG12
  const u1 = (G21 / S1) ** 2 // for τ21·G21²/S1²
  const u2 = G12 / (S2 * S2) // for τ12·G12/S2²
  const v1 = (G12 / S2) ** 2
  const v2 = G21 / (S1 * S1)
  out[0] = x2 * x2 * (t21 * u1 + t12 * u2)
  out[1] = x1 * x1 * (t12 * v1 + t21 * v2)
  const du1 = 2 * u1 * (dG21 / G21 - dS1 / S1)
  const du2 = u2 * (dG12 / G12 - (2 * dS2) / S2)
  const dv1 = 2 * v1 * (dG12 / G12 - dS2 / S2)
  const dv2 = v2 * (dG21 / G21 - (2 * dS1) / S1)
  out[2] = x2 * x2 * (dt21 * u1 + t21 * du1 + dt12 * u2 + t12 * du2)
  out[3] = x1 * x1 * (dt12 * v1 + t12 * dv1 + dt21 * v2 + t21 * dv2)
}

function uniquac(
  m: Extract<ActivityModel, { kind: 'uniquac' }>,
  x1: number,
  x2: number,
  T: number,
  out: Float64Array,
): void {
  const { r1, r2, q1, q2 } = m
  const z2 = 5 // z/2 with coordination number z = 10
  const sr = r1 * x1 + r2 * x2
  const sq = q1 * x1 + q2 * x2
  const l1 = z2 * (r1 - q1) - (r1 - 1)
  const l2 = z2 * (r2 - q2) - (r2 - 1)
  // Ratios written so x → 0 stays finite: Φi/xi = ri/Σr, θi/Φi = (qi/ri)(Σr/Σq).
  const p1x = r1 / sr
  const p2x = r2 / sr
  const sl = x1 * l1 + x2 * l2
  const c1 = Math.log(p1x) + z2 * q1 * Math.log((q1 / r1) * (sr / sq)) + l1 - p1x * sl
  const c2 = Math.log(p2x) + z2 * q2 * Math.log((q2 / r2) * (sr / sq)) + l2 - p2x * sl
  const th1 = (q1 * x1) / sq
  const th2 = (q2 * x2) / sq
  const RT = R * T
  // Temperature-dependent energies a(T) = a + aT·(T − 298.15 K) when aT is given (0 otherwise).
  const a12T = m.a12T ?? 0
  const a21T = m.a21T ?? 0
  const a12 = m.a12 + a12T * (T - T_REF)
  const a21 = m.a21 + a21T * (T - T_REF)
  const t12 = Math.exp(-a12 / RT)
  const t21 = Math.exp(-a21 / RT)
  // d/dT of −a(T)/RT = a/(RT·T) − aT/RT
  const dt12 = t12 * (a12 / (RT * T) - a12T / RT)
  const dt21 = t21 * (a21 / (RT * T) - a21T / RT)
  const E1 = th1 + th2 * t21
  const E2 = th1 * t12 + th2
  out[0] = c1 + q1 * (1 - Math.log(E1) - th1 / E1 - (th2 * t12) / E2)
  out[1] = c2 + q2 * (1 - Math.log(E2) - th2 / E2 - (th1 * t21) / E1)
  out[2] = -q1 * th2 * th2 * ((t21 * dt21) / (E1 * E1) + dt12 / (E2 * E2))
  out[3] = -q2 * th1 * th1 * ((t12 * dt12) / (E2 * E2) + dt21 / (E1 * E1))
}

/**
 * NRTL derivatives of ln γ with respect to the reduced energies τ12 and τ21 (α fixed) at x1 and T, analytic:
 * out[0] = ∂ln γ1/∂τ12, out[1] = ∂ln γ2/∂τ12, out[2] = ∂ln γ1/∂τ21, out[3] = ∂ln γ2/∂τ21. With S2 = x2 + x1·G12,
 * ∂ln γ1/∂τ12 = x2²·G12/S2²·(1 − ατ12 + 2ατ12·x1G12/S2) and ∂ln γ2/∂τ12 = x1²·G12²/S2²·(1 − 2ατ12 + 2ατ12·x1G12/S2);
 * the τ21 pair by exchanging the components. Used for the fits' Jacobians (checked against finite differences).
 */
export function nrtlTauGradient(
  m: Extract<ActivityModel, { kind: 'nrtl' }>,
  x1: number,
  T: number,
  out: Float64Array,
): void {
  const x2 = 1 - x1
  const RT = R * T
  const a = m.alpha
  const t12 = (m.b12 + (m.b12T ?? 0) * (T - T_REF)) / RT
  const t21 = (m.b21 + (m.b21T ?? 0) * (T - T_REF)) / RT
  const G12 = Math.exp(-a * t12)
  const G21 = Math.exp(-a * t21)
  const S1 = x1 + x2 * G21
  const S2 = x2 + x1 * G12
  const h12 = (2 * a * t12 * x1 * G12) / S2
  const h21 = (2 * a * t21 * x2 * G21) / S1
  const g12 = G12 / (S2 * S2)
  const g21 = G21 / (S1 * S1)
  out[0] = x2 * x2 * g12 * (1 - a * t12 + h12)
  out[1] = x1 * x1 * G12 * g12 * (1 - 2 * a * t12 + h12)
  out[2] = x2 * x2 * G21 * g21 * (1 - 2 * a * t21 + h21)
  out[3] = x1 * x1 * g21 * (1 - a * t21 + h21)
}

/**
 * NRTL ∂ln γ1/∂x1 at x1 and T, analytic: with A = τ21·G21²/S1² + τ12·G12/S2², S1 = x1 + x2·G21, S2 = x2 + x1·G12,
 * ln γ1 = x2²·A and ∂ln γ1/∂x1 = −2x2·A + x2²·[−2τ21·G21²(1 − G21)/S1³ − 2τ12·G12(G12 − 1)/S2³]. The liquid-stability
 * screens use it for the thermodynamic factor Γ = 1 + x1·∂ln γ1/∂x1 (checked against finite differences).
 */
export function nrtlDlnGamma1Dx1(m: Extract<ActivityModel, { kind: 'nrtl' }>, x1: number, T: number): number {
  const x2 = 1 - x1
  const RT = R * T
  const t12 = (m.b12 + (m.b12T ?? 0) * (T - T_REF)) / RT
  const t21 = (m.b21 + (m.b21T ?? 0) * (T - T_REF)) / RT
  const G12 = Math.exp(-m.alpha * t12)
  const G21 = Math.exp(-m.alpha * t21)
  const S1 = x1 + x2 * G21
  const S2 = x2 + x1 * G12
  const A = (t21 * G21 * G21) / (S1 * S1) + (t12 * G12) / (S2 * S2)
  const dA = (-2 * t21 * G21 * G21 * (1 - G21)) / (S1 * S1 * S1) - (2 * t12 * G12 * (G12 - 1)) / (S2 * S2 * S2)
  return -2 * x2 * A + x2 * x2 * dA
}
