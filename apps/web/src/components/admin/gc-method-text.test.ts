import { describe, expect, it } from 'vitest'
import { retireMethodText } from './gc-method-text'

describe('retireMethodText', () => {
  it('names the method and how many active calibrations go with it', () => {
    expect(retireMethodText('FID-1', 0)).toBe('Retire FID-1? It has no active calibration. Nobody can fit a new calibration on it or upload runs with its calibrations; points already computed keep their link. This cannot be undone here.')
    expect(retireMethodText('FID-1', 1)).toContain('Its active calibration is retired with it.')
    expect(retireMethodText('FID-1', 3)).toContain('Its 3 active calibrations are retired with it.')
  })
})
