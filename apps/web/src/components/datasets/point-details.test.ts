/**
 * The point-details card says where a point came from: the uploaded file and its lines, or that it was typed in
 * (no file); a hostile file name stays text.
 */
import { mount } from '@vue/test-utils'
import { createPinia } from 'pinia'
import PrimeVue from 'primevue/config'
import { describe, expect, it } from 'vitest'
import type { DataSetDetail } from '../../api/datasets'
import PointDetails from './PointDetails.vue'

const point = (over: Record<string, unknown>) => ({
  id: 'p1',
  dataSetId: 'd1',
  seq: 1,
  sampleLabel: 'S-01',
  temperatureK: 340.15,
  pressurePa: 101325,
  x1: 0.25,
  x1Uncertainty: 0.002,
  y1: 0.41,
  y1Uncertainty: 0.003,
  excluded: false,
  exclusionReason: null,
  uploadId: null,
  calibrationId: null,
  rowRefs: [],
  ...over,
})

function card(p: Record<string, unknown>, uploads: { id: string; originalName: string }[] = []) {
  const detail = { points: [point(p)], uploads, calibrations: [], fits: [] } as unknown as DataSetDetail
  return mount(PointDetails, {
    props: { detail, pointId: 'p1', curves: [], visible: [], outlier: false },
    global: { plugins: [createPinia(), PrimeVue] },
  })
}

describe('point details: where the point came from', () => {
  it('a typed point says so and names no file or lines', () => {
    const text = card({}).find('[data-test="point-source"]').text()
    expect(text).toBe('typed in on screen (no file)')
  })
  it('an uploaded point names its file and lines', () => {
    const w = card({ uploadId: 'u1', rowRefs: [4, 5] }, [{ id: 'u1', originalName: 'still-run-07.csv' }])
    expect(w.find('[data-test="point-source"]').text().replace(/\s+/g, ' ')).toBe('still-run-07.csv, lines 4, 5')
    const one = card({ uploadId: 'u1', rowRefs: [9] }, [{ id: 'u1', originalName: 'still-run-07.csv' }])
    expect(one.find('[data-test="point-source"]').text().replace(/\s+/g, ' ')).toBe('still-run-07.csv, line 9')
  })
  it('keeps a hostile file name as text', () => {
    const name = '<img src=x onerror=alert(1)>=HYPERLINK("x").csv'
    const w = card({ uploadId: 'u1', rowRefs: [2] }, [{ id: 'u1', originalName: name }])
    expect(w.find('[data-test="point-source"] img').exists()).toBe(false)
    expect(w.find('[data-test="point-source"]').text()).toContain(name)
  })
})
