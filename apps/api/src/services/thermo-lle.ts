/**
 * TEMPORARY bridge to the engine's liquid–liquid functions (findAzeotropes, phaseDiagram's threePhase and
 * lle) while they are being added to @ebullio/thermo; it falls back to the older single-azeotrope search.
 * Remove it once those functions are in the engine.
 */
import * as thermo from '@ebullio/thermo'
import type { Azeotrope, BinarySystem, PhaseDiagram } from '@ebullio/thermo'

export type AnyAzeotrope = Omit<Azeotrope, 'kind'> & {
  kind: 'minimum-boiling' | 'maximum-boiling' | 'heterogeneous'
  liquidPhases?: [number, number]
}
export type ThreePhaseLine = { T: number; x1I: number; x1II: number; y1: number }
export type IsobaricDiagram = Extract<PhaseDiagram, { kind: 'isobaric' }> & {
  threePhase?: ThreePhaseLine | null
  lle?: { T: number[]; x1I: number[]; x1II: number[] } | null
}

type Condition = { P: number } | { T: number }

/** Every azeotrope at fixed P (Pa) or T (K). */
export function allAzeotropes(system: BinarySystem, condition: Condition): AnyAzeotrope[] {
  const all = (thermo as unknown as Record<string, unknown>).findAzeotropes as
    ((s: BinarySystem, c: Condition) => AnyAzeotrope[]) | undefined
  if (all) return all(system, condition)
  const one = thermo.findAzeotrope(system, condition as never)
  return one ? [one] : []
}

/** The isobaric diagram at P (Pa), with the three-phase line and (when `lle`) the two-liquid region. */
export function isobaricDiagram(
  system: BinarySystem,
  P: number,
  options: { points?: number; lle?: boolean; lleFromT?: number } = {},
): IsobaricDiagram {
  const d = thermo.phaseDiagram(system, { P }, options as { points?: number })
  if (d.kind !== 'isobaric') throw new Error('Expected an isobaric diagram.')
  return d as IsobaricDiagram
}

/** The two coexisting liquids at T (K), or null (also null while the engine lacks the function). */
export function liquidLiquid(system: BinarySystem, T: number): { x1I: number; x1II: number } | null {
  const lle = (thermo as unknown as Record<string, unknown>).liquidLiquidEquilibrium as
    ((s: BinarySystem, at: { T: number }) => { x1I: number; x1II: number } | null) | undefined
  return lle ? lle(system, { T }) : null
}

/** True once the engine computes liquid–liquid splitting (the demo's partially miscible data set needs it). */
export const ENGINE_HAS_LLE =
  typeof (thermo as unknown as Record<string, unknown>).liquidLiquidEquilibrium === 'function'
