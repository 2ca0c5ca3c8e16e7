/**
 * The column-estimate screen drops its last results as soon as a field error shows: the numbers on screen must
 * always belong to the inputs beside them (the batch-still screen does the same).
 */
import type { BinarySystem } from '@ebullio/thermo'
import { flushPromises, mount } from '@vue/test-utils'
import { createPinia } from 'pinia'
import PrimeVue from 'primevue/config'
import { describe, expect, it } from 'vitest'
import ColumnEstimatePanel from './ColumnEstimatePanel.vue'

// Antoine constants, ln(P/kPa) = A − B/(t/°C + C): Smith, Van Ness & Abbott, 7th ed., Table B.2
// (benzene read in print; toluene from memory). Ideal liquid: no azeotrope, every target reachable.
const benzeneToluene: BinarySystem = {
  vaporPressure: [
    { kind: 'antoine', A: 13.7819, B: 2726.81, C: 217.572, log: 'ln', pressureUnit: 'kPa', temperatureUnit: 'C' },
    { kind: 'antoine', A: 13.932, B: 3056.96, C: 217.625, log: 'ln', pressureUnit: 'kPa', temperatureUnit: 'C' },
  ],
  activity: { kind: 'ideal' },
}

/** A plain number box in place of PrimeVue's InputNumber, so the test can type into it. */
const NumberBox = {
  props: ['modelValue'],
  emits: ['update:modelValue'],
  template: '<input :value="modelValue" @change="$emit(\'update:modelValue\', Number($event.target.value))" />',
}

function panel() {
  return mount(ColumnEstimatePanel, {
    props: { system: benzeneToluene, pressurePa: 101325, names: ['benzene', 'toluene'], azeotrope: null },
    global: { plugins: [createPinia(), PrimeVue], stubs: { InputNumber: NumberBox, XyPlot: true } },
  })
}

describe('column estimate panel', () => {
  it('clears the previous estimate when a field error shows', async () => {
    const w = panel()
    await w.find('form').trigger('submit')
    await flushPromises()
    expect(w.find('[data-test="col-stages"]').exists()).toBe(true)
    await w.find('[data-test="col-rFactor"]').setValue('0.8')
    await w.find('form').trigger('submit')
    await flushPromises()
    expect(w.text()).toContain('R must be more than the minimum (a multiple above 1)')
    expect(w.find('[data-test="col-stages"]').exists()).toBe(false)
    expect(w.find('[data-test="col-nmin"]').exists()).toBe(false)
    expect(w.find('[data-test="col-fix-fields"]').exists()).toBe(true)
    // Fixed again, the estimate comes back.
    await w.find('[data-test="col-rFactor"]').setValue('1.3')
    await w.find('form').trigger('submit')
    await flushPromises()
    expect(w.find('[data-test="col-stages"]').exists()).toBe(true)
    expect(w.find('[data-test="col-fix-fields"]').exists()).toBe(false)
  })
})
