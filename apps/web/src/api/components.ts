import type { ComponentProperties } from '@ebullio/schemas'
/** Pure components and their vapour-pressure sets (issue 5's `/api/components` routes). Molar mass g/mol, volume cm³/mol. */
import type { ComponentDto, VaporPressureSetDto } from '@ebullio/schemas'
import { api, query } from './client'

export type Component = ComponentDto

/** A published vapour-pressure correlation, stored as published (thermo's VaporPressureModel in `parameters`). */
export type VaporPressureSet = Omit<VaporPressureSetDto, 'parameters'> & {
  parameters: Record<string, unknown> & { kind: string }
}

/** A measured pure-component boiling point: T in K at P in Pa. */
export interface PureMeasurement {
  id: string
  temperatureK: number
  pressurePa: number
  note: string | null
  thermometer?: string | null
  still?: string | null
  /** YYYY-MM-DD */
  measuredOn?: string | null
  /** set when it came from a run file */
  uploadId?: string | null
  dataSetId?: string | null
  /** T (K) of the preferred vapour-pressure set at this pressure, and measured − correlated (K) */
  correlatedK?: number | null
  dT?: number | null
}

export interface ComponentDetail extends Component {
  vaporPressureSets: VaporPressureSet[]
  pureMeasurements: PureMeasurement[]
  /** source of the correlation the measurements are compared with */
  correlationSource?: string | null
}

export interface ComponentInput {
  name: string
  casNumber: string | null
  formula: string | null
  molarMass: number
  liquidMolarVolume: number | null
  properties?: ComponentProperties | null
}

export interface VaporPressureInput {
  model: Record<string, unknown>
  source: string
  preferred: boolean
}

export const componentsApi = {
  list: (o: {
    q?: string
    page?: number
    pageSize?: number
    sort?: 'name' | 'created_at' | 'molar_mass'
    order?: 'asc' | 'desc'
  }) => api.get<{ items: Component[]; total: number; page: number; pageSize: number }>('/api/components' + query(o)),
  get: (id: string) => api.get<ComponentDetail>(`/api/components/${id}`),
  create: (body: ComponentInput) => api.post<Component>('/api/components', body, { quiet: true }),
  update: (id: string, rowVersion: number, patch: Partial<ComponentInput>) =>
    api.patch<Component>(`/api/components/${id}`, { rowVersion, ...patch }, { quiet: true }),
  remove: (id: string) => api.del<void>(`/api/components/${id}`),
  addVaporPressureSet: (id: string, body: VaporPressureInput) =>
    api.post<VaporPressureSet>(`/api/components/${id}/vapor-pressure-sets`, body, { quiet: true }),
}
