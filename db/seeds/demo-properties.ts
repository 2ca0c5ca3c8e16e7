import type { ComponentProperties } from '@ebullio/schemas'

/**
 * Critical constants of the demo components, keyed by CAS number: Tc, Pc, ω, Vc and the dipole moment as the
 * Python library `chemicals` 1.5.2 gives them (its default data sources), frozen here; Tsonopoulos a and b from
 * the published polar classes (Tsonopoulos, AIChE J. 20 (1974) 263; water: Tsonopoulos & Heidman, Fluid Phase
 * Equilib. 57 (1990) 261) as computed by @ebullio/thermo's tsonopoulosPolarParameters. UNIQUAC r and q are sums of
 * the UNIFAC group volumes R and areas Q of Hansen et al., Ind. Eng. Chem. Res. 30 (1991) 2352 (group values from
 * memory, not checked against the printed table): CH3 0.9011/0.848, CH2 0.6744/0.540, OH 1.0000/1.200,
 * CH3OH 1.4311/1.432, H2O 0.9200/1.400, CH3CO 1.6724/1.488, CHCl3 2.8700/2.410, ACH 0.5313/0.400,
 * ACCH3 1.2663/0.968; each component's breakdown is in its `source` (RQ below).
 * Methanol and water also carry the Hayden–O'Connell mean radius of gyration and association η of the correlation's
 * own tables (Hayden & O'Connell 1975; from memory, stated in `associationSource`).
 */
const SOURCE =
  'Tc, Pc, ω, Vc, dipole: Python library chemicals 1.5.2; Tsonopoulos a, b: published polar class rules (Tsonopoulos 1974)'

const HOC_SOURCE =
  "RD and η: Hayden & O'Connell, Ind. Eng. Chem. Process Des. Dev. 14 (1975) 209, tables (from memory, not checked against the printed page)"

const RQ_SOURCE =
  'UNIQUAC r, q: sums of UNIFAC group R, Q (Hansen et al., Ind. Eng. Chem. Res. 30 (1991) 2352; group values from memory)'

/** UNIQUAC r and q by CAS number, with the group breakdown they are summed from (Hansen et al. 1991, from memory). */
const RQ: Record<string, { r: number; q: number; groups: string }> = {
  '67-64-1': { r: 2.5735, q: 2.336, groups: 'CH3 + CH3CO' }, // acetone
  '67-56-1': { r: 1.4311, q: 1.432, groups: 'CH3OH' }, // methanol
  '7732-18-5': { r: 0.92, q: 1.4, groups: 'H2O' }, // water
  '71-23-8': { r: 3.2499, q: 3.128, groups: 'CH3 + 2 CH2 + OH' }, // 1-propanol
  '67-66-3': { r: 2.87, q: 2.41, groups: 'CHCl3' }, // chloroform
  '110-54-3': { r: 4.4998, q: 3.856, groups: '2 CH3 + 4 CH2' }, // n-hexane
  '142-82-5': { r: 5.1742, q: 4.396, groups: '2 CH3 + 5 CH2' }, // n-heptane
  '71-36-3': { r: 3.9243, q: 3.668, groups: 'CH3 + 3 CH2 + OH' }, // 1-butanol
  '64-17-5': { r: 2.5755, q: 2.588, groups: 'CH3 + CH2 + OH' }, // ethanol
  '71-43-2': { r: 3.1878, q: 2.4, groups: '6 ACH' }, // benzene
  '108-88-3': { r: 3.9228, q: 2.968, groups: '5 ACH + ACCH3' }, // toluene
}

/** The critical data below with UNIQUAC r and q added, and their source (with the group breakdown) in `source`. */
function withRq(props: Record<string, ComponentProperties>): Record<string, ComponentProperties> {
  return Object.fromEntries(
    Object.entries(props).map(([cas, p]) => {
      const rq = RQ[cas]
      if (!rq) return [cas, p]
      return [cas, { ...p, uniquacR: rq.r, uniquacQ: rq.q, source: `${p.source}; ${RQ_SOURCE}: ${rq.groups}` }]
    }),
  )
}

export const DEMO_PROPERTIES: Record<string, ComponentProperties> = withRq({
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
})
