/**
 * The vapour-model fields: the correlation choice, η12 and its source under Hayden–O'Connell (dropped again when
 * Tsonopoulos is chosen), hostile text in the source kept as text; and the server's answers about the vapour model
 * shown beside it.
 */
import { mount } from '@vue/test-utils'
import type { VaporModelChoice } from '@ebullio/schemas'
import PrimeVue from 'primevue/config'
import { describe, expect, it } from 'vitest'
import { nextTick } from 'vue'
import { ApiError } from '../../api/client'
import VapourModelFields from './VapourModelFields.vue'
import { vapourProblem } from './vapour-problem'

function mountFields(start: VaporModelChoice) {
  let value = start
  const w = mount(VapourModelFields, {
    props: {
      modelValue: value,
      'onUpdate:modelValue': (v: VaporModelChoice) => {
        value = v
        void w.setProps({ modelValue: v })
      },
    },
    global: { plugins: [PrimeVue] },
  })
  return { w, value: () => value }
}

describe('VapourModelFields', () => {
  it("chooses Hayden–O'Connell with η12 and its source, and drops them again for Tsonopoulos", async () => {
    const { w, value } = mountFields({ kind: 'ideal' })
    await w.get('[data-test="vapour-virial"] input').setValue(true)
    expect(value()).toEqual({ kind: 'virial', correlation: 'tsonopoulos', poynting: false })
    expect(w.find('[data-test="vapour-eta12"]').exists()).toBe(false)
    await w.get('[data-test="vapour-hayden-oconnell"] input').setValue(true)
    expect(value()).toEqual({ kind: 'virial', correlation: 'hayden-oconnell', poynting: false })
    const hostile = '<img src=x onerror=alert(1)> =HYPERLINK("x")'
    await w.get('[data-test="vapour-eta12-source"]').setValue(hostile)
    expect(value()).toMatchObject({ correlation: 'hayden-oconnell', eta12Source: hostile })
    await nextTick()
    expect(w.html()).not.toContain('<img src=x')
    await w.get('[data-test="vapour-poynting"] input').setValue(true)
    expect(value()).toMatchObject({ correlation: 'hayden-oconnell', poynting: true, eta12Source: hostile })
    await w.get('[data-test="vapour-tsonopoulos"] input').setValue(true)
    expect(value()).toEqual({ kind: 'virial', correlation: 'tsonopoulos', poynting: true })
  })
})

describe('vapourProblem', () => {
  it('takes what the server said about the vapour model, and nothing else', () => {
    expect(vapourProblem(new ApiError(422, 'invalid_vapour_model', 'ε/k < 0'))).toBe('ε/k < 0')
    expect(vapourProblem(new ApiError(422, 'missing_critical_data', 'missing — methanol: RD'))).toBe(
      'missing — methanol: RD',
    )
    const validation = new ApiError(422, 'validation_failed', 'Check the fields', [
      { path: 'vaporModel.eta12Source', message: 'Name the source of the solvation parameter η12 (paper and table)' },
      { path: 'title', message: 'Give a title' },
    ])
    expect(vapourProblem(validation)).toBe('Name the source of the solvation parameter η12 (paper and table)')
    expect(vapourProblem(new ApiError(422, 'validation_failed', 'x', [{ path: 'title', message: 't' }]))).toBeNull()
    expect(vapourProblem(new Error('x'))).toBeNull()
  })
})
