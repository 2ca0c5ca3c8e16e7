import { describe, expect, it } from 'vitest'
import { calibrationRangeText, retireMethodText, rSquaredText } from './gc-method-text'

describe('retireMethodText', () => {
  it('names the method and how many active calibrations go with it', () => {
    expect(retireMethodText('FID-1', 0)).toBe(
      'Retire FID-1? It has no active calibration. Nobody can fit a new calibration on it or upload runs with its calibrations; points already computed keep their link. This cannot be undone here.',
    )
    expect(retireMethodText('FID-1', 1)).toContain('Its active calibration is retired with it.')
    expect(retireMethodText('FID-1', 3)).toContain('Its 3 active calibrations are retired with it.')
  })
})

describe('calibration figures in the GC methods table', () => {
  // The same digits as the calibration preview (components/admin/CalibrationDialog.vue: R² to 5 decimals, range to 3).
  it('writes R² to 5 decimals, so 0.999991 is not rounded up to a perfect 1', () => {
    expect(rSquaredText(0.999991)).toBe('0.99999')
    expect(rSquaredText(null)).toBe('—')
  })
  it('writes the range of x₁ to 3 decimals', () => {
    expect(calibrationRangeText(0.02, 0.985)).toBe('0.020–0.985')
  })
})
