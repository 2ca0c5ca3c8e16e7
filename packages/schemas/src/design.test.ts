import { describe, expect, it } from 'vitest'
import { batchStillSchema } from './design.js'

const base = { moles: 100, x1: 0.3, stagesAbovePot: 0, R: 2 }
/** The message on stopValue, or null when the input passes. */
const stopMessage = (stopBy: string, stopValue: number, extra: Partial<typeof base> = {}) => {
  const r = batchStillSchema.safeParse({ ...base, ...extra, stopBy, stopValue })
  return r.success
    ? null
    : (r.error.issues.find((i) => i.path[0] === 'stopValue')?.message ?? r.error.issues[0].message)
}

describe('batchStillSchema stop conditions', () => {
  it('accepts each kind of stop inside its range', () => {
    expect(stopMessage('distilledFraction', 0.6)).toBeNull()
    expect(stopMessage('potMoles', 40)).toBeNull()
    expect(stopMessage('distillateMoles', 60)).toBeNull()
    expect(stopMessage('potX1', 0.05)).toBeNull()
    expect(stopMessage('recovery1', 0.9)).toBeNull()
  })

  it('names what is wrong with each stop, word for word', () => {
    expect(stopMessage('distilledFraction', 1)).toBe('Stop before the pot runs dry (below 100 %)')
    expect(stopMessage('distilledFraction', 0)).toBe('Distil more than 0 %')
    expect(stopMessage('potMoles', 100)).toBe('The amount must be less than the charge (100 mol)')
    expect(stopMessage('distillateMoles', -1)).toBe('The amount must be more than 0 mol')
    expect(stopMessage('potX1', 1)).toBe('The pot composition must be below 1')
    expect(stopMessage('potX1', 0.3)).toBe('The pot starts at this composition; choose another one')
    expect(stopMessage('recovery1', 1)).toBe('The recovery must be below 1 (all of component 1 needs the pot run dry)')
    expect(stopMessage('recovery1', 0)).toBe('The recovery must be above 0')
  })

  it('refuses an unknown stop', () => {
    expect(stopMessage('temperature', 350)).toBe('Choose when to stop')
  })
})
