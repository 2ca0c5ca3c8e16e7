/** Binary systems and components as the laboratory screens need them (pickers, vapour-pressure sets for curves). */
import { api, query } from './client'
import type { LabComponent, LabSystem } from './datasets'

export const systemsLabApi = {
  /** Systems whose component names or CAS numbers match `q`. */
  list: (q: string, pageSize = 20) =>
    api.get<{ items: LabSystem[]; total: number }>('/api/systems' + query({ q, page: 1, pageSize })),
  get: (id: string) => api.get<LabSystem>(`/api/systems/${id}`),
  component: (id: string) => api.get<LabComponent>(`/api/components/${id}`),
}
