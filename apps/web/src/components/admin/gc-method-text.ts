/** Words of the GC methods screen that depend on counts (kept here so they can be unit-tested). */

/**
 * The confirmation shown before retiring a GC method.
 * @param name the method's name
 * @param activeCalibrations how many of its calibrations are active now (they are retired with it)
 */
export function retireMethodText(name: string, activeCalibrations: number): string {
  const cals = activeCalibrations === 0
    ? 'It has no active calibration.'
    : `Its ${activeCalibrations === 1 ? 'active calibration is' : `${activeCalibrations} active calibrations are`} retired with it.`
  return `Retire ${name}? ${cals} Nobody can fit a new calibration on it or upload runs with its calibrations; points already computed keep their link. This cannot be undone here.`
}
