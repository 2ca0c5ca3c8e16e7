/**
 * Joint fits of a system (one parameter set over several data sets) and the system's signed recommended
 * parameter set. T in K, P in Pa, energies J/mol and their temperature terms J/(mol·K).
 */
import type { JointFitDto, JointFitRequest, RecommendedParameterSetDto } from '@ebullio/schemas'
import { api } from './client'

export type JointFit = JointFitDto
export type RecommendedSet = RecommendedParameterSetDto

/** One contributing data set against the joint model: at its nominal pressure (isobaric) or temperature (isothermal). */
export type JointFitPlot = {
  dataSetId: string
  title: string
  version: number
  points: { T: number; P: number; x1: number; y1: number | null; excluded: boolean }[]
} & (
  | {
      kind: 'isobaric'
      /** the data set's nominal pressure, Pa */
      P: number
      T: null
      /** the joint model's bubble (x1, T) and dew (y1, T) lines at P */
      curve: { x1: number[]; y1: number[]; T: number[] }
    }
  | {
      kind: 'isothermal'
      P: null
      /** K */
      T: number
      /** the joint model's bubble (x1, P) and dew (y1, P) lines at T, P in Pa */
      curve: { x1: number[]; y1: number[]; P: number[] }
    }
)

/** The engineer's curve with the recommended set (GET …/recommended-parameters/curve). */
export interface RecommendedCurve {
  recommendedSetId: string
  label: string
  P: number
  range: { Tmin: number; Tmax: number; Pmin: number; Pmax: number }
  pressureInRange: boolean
  rangeWarning: string | null
  diagram: { x1: number[]; y1: number[]; T: number[] }
}

export const jointFitsApi = {
  list: (systemId: string) => api.get<{ items: JointFit[] }>(`/api/systems/${systemId}/joint-fits`),
  run: (systemId: string, body: JointFitRequest) =>
    api.post<JointFit>(`/api/systems/${systemId}/joint-fits`, body, { quiet: true }),
  plots: (id: string) =>
    api.get<{ jointFitId: string; components: [string, string]; plots: JointFitPlot[] }>(`/api/joint-fits/${id}/plots`),
  submit: (id: string, rowVersion: number) =>
    api.post<{ notifiedLeadChemists: number }>(`/api/joint-fits/${id}/submit`, { rowVersion }, { quiet: true }),
  approve: (id: string, body: { password: string; reason: string; rowVersion: number }) =>
    api.post<{ digest: string; jointFit: JointFit }>(`/api/joint-fits/${id}/approve`, body, { quiet: true }),
  /** Return a submitted joint fit for rework (lead chemist; password and reason). */
  returnForRework: (id: string, body: { password: string; reason: string; rowVersion: number }) =>
    api.post<{ digest: string; jointFit: JointFit }>(`/api/joint-fits/${id}/return`, body, { quiet: true }),
  remove: (id: string) => api.del<{ deleted: string }>(`/api/joint-fits/${id}`, { quiet: true }),
  /** The system's signed recommended set; 404 (quietly) when it has none. */
  recommended: (systemId: string) =>
    api.get<RecommendedSet>(`/api/systems/${systemId}/recommended-parameters`, { quiet: true }),
}
