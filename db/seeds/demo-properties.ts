import type { ComponentProperties } from '@ebullio/schemas'

/**
 * Critical constants of the demo components, keyed by CAS number: Tc, Pc, ω, Vc and the dipole moment as the
 * Python library `chemicals` 1.5.2 gives them (its default data sources), frozen here; Tsonopoulos a and b from
 * the published polar classes (Tsonopoulos, AIChE J. 20 (1974) 263; water: Tsonopoulos & Heidman, Fluid Phase
 * Equilib. 57 (1990) 261) as computed by @ebullio/thermo's tsonopoulosPolarParameters. UNIQUAC r and q are left empty.
 * Methanol and water also carry the Hayden–O'Connell mean radius of gyration and association η of the correlation's
 * own tables (Hayden & O'Connell 1975; from memory, stated in `associationSource`).
 */
const SOURCE =
  'Tc, Pc, ω, Vc, dipole: Python library chemicals 1.5.2; Tsonopoulos a, b: published polar class rules (Tsonopoulos 1974)'

const HOC_SOURCE =
  "RD and η: Hayden & O'Connell, Ind. Eng. Chem. Process Des. Dev. 14 (1975) 209, tables (from memory, not checked against the printed page)"

export const DEMO_PROPERTIES: Record<string, ComponentProperties> = {
  '67-64-1': {
    Tc: 508.1,
    Pc: 4692400.0,
    omega: 0.3071,
    Vc: 212.766,
    dipole: 2.88,
    tsonopoulosA: -0.032875,
    tsonopoulosB: 0,
    source: SOURCE,
  },
  '67-56-1': {
    Tc: 513.38,
    Pc: 8215850.0,
    omega: 0.5625,
    Vc: 113.828,
    dipole: 1.7,
    tsonopoulosA: 0.0878,
    tsonopoulosB: 0.0525,
    radiusOfGyration: 1.536,
    associationEta: 1.63,
    associationSource: HOC_SOURCE,
    source: SOURCE,
  },
  '7732-18-5': {
    Tc: 647.096,
    Pc: 22064000.0,
    omega: 0.3443,
    Vc: 55.948,
    dipole: 1.85,
    tsonopoulosA: -0.0109,
    tsonopoulosB: 0,
    radiusOfGyration: 0.615,
    associationEta: 1.7,
    associationSource: HOC_SOURCE,
    source: SOURCE,
  },
  '71-23-8': {
    Tc: 536.8,
    Pc: 5169000.0,
    omega: 0.624,
    Vc: 218.0,
    dipole: 1.55,
    tsonopoulosA: 0.0878,
    tsonopoulosB: 0.03867,
    source: SOURCE,
  },
  '67-66-3': {
    Tc: 536.2,
    Pc: 5330000.0,
    omega: 0.216,
    Vc: 244.0,
    dipole: 1.01,
    tsonopoulosA: -2.7e-6,
    tsonopoulosB: 0,
    source: SOURCE,
  },
  '110-54-3': {
    Tc: 507.82,
    Pc: 3044100.0,
    omega: 0.3,
    Vc: 369.549,
    dipole: 0.0,
    tsonopoulosA: 0,
    tsonopoulosB: 0,
    source: SOURCE,
  },
  '142-82-5': {
    Tc: 540.2,
    Pc: 2735730.0,
    omega: 0.349,
    Vc: 429.185,
    dipole: 0.0,
    tsonopoulosA: 0,
    tsonopoulosB: 0,
    source: SOURCE,
  },
  '71-36-3': {
    Tc: 563.0,
    Pc: 4414000.0,
    omega: 0.59,
    Vc: 274.0,
    dipole: 1.66,
    tsonopoulosA: 0.0878,
    tsonopoulosB: 0.035427,
    source: SOURCE,
  },
  '64-17-5': {
    Tc: 514.71,
    Pc: 6268000.0,
    omega: 0.646,
    Vc: 168.634,
    dipole: 1.44,
    tsonopoulosA: 0.0878,
    tsonopoulosB: 0.042765,
    source: SOURCE,
  },
  '71-43-2': {
    Tc: 562.02,
    Pc: 4907277.0,
    omega: 0.211,
    Vc: 256.345,
    dipole: 0.0,
    tsonopoulosA: 0,
    tsonopoulosB: 0,
    source: SOURCE,
  },
  '108-88-3': {
    Tc: 591.75,
    Pc: 4126300.0,
    omega: 0.2657,
    Vc: 315.557,
    dipole: 0.33,
    tsonopoulosA: 0,
    tsonopoulosB: 0,
    source: SOURCE,
  },
}
