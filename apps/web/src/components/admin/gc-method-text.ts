/** Words of the GC methods screen that depend on counts (kept here so they can be unit-tested). */

/**
 * The confirmation shown before retiring a GC method.
 * @param name the method's name
 * @param activeCalibrations how many of its calibrations are active now (they are retired with it)
 */
export function retireMethodText(name: string, activeCalibrations: number): string {
  const cals =
    activeCalibrations === 0
      ? 'It has no active calibration.'
      : `Its ${activeCalibrations === 1 ? 'active calibration is' : `${activeCalibrations} active calibrations are`} retired with it.`
  return `Retire ${name}? ${cals} Nobody can fit a new calibration on it or upload runs with its calibrations; points already computed keep their link. This cannot be undone here.`
}

/** R² of a calibration with 5 decimals, as the calibration preview and the run preview show it ("0.99999"); "—" when missing. */
export function rSquaredText(r: number | null | undefined): string {
  return r === null || r === undefined || !Number.isFinite(r) ? '—' : r.toFixed(5)
}

/** A calibration's range of x₁ with 3 decimals, as the lab screens write it ("0.020–0.985"). */
export function calibrationRangeText(min: number, max: number): string {
  return `${min.toFixed(3)}–${max.toFixed(3)}`
}
