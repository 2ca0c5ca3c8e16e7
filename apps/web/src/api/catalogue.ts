/**
 * The engineers' catalogue of approved systems and what can be downloaded from an approved data set
 * (issue 5's catalogue and export routes). T in K, P in Pa, compositions as mole fractions of component 1.
 */
import type {
  ApprovedVersionDto,
  CatalogueEntryDto,
  Citation,
  DataKind,
  ComponentDto,
  FitDto,
  PointDto,
  RecommendedParameterSetDto,
  SystemDto,
  VaporModelChoice,
} from '@ebullio/schemas'
import { api, query } from './client'
import type { VapourCorrection } from './datasets'

/** A pure component as the catalogue shows it (the API's own wire type, from @ebullio/schemas). */
export type CatalogueComponent = ComponentDto
export type CatalogueSystem = SystemDto
/** An approved version of a data set with the fit it was approved with. */
export type ApprovedVersion = ApprovedVersionDto
export type CatalogueEntry = CatalogueEntryDto

/** The documented `ebullio-parameters/1` export of an approved data set (docs/csv-formats.md). */
export interface ParametersExport {
  format: string
  dataSet: {
    id: string
    title: string
    version: number
    state: string
    /** Pa; null for an isothermal set that recorded none */
    nominalPressurePa: number | null
    /** isobaric (T–x–y, T–x) or isothermal (P–x–y, P–x); older exports: absent (isobaric) */
    kind?: DataKind
    /** K, isothermal sets */
    nominalTemperatureK?: number | null
    /** the vapour model the data set chose (its fits state their own as `vapor`) */
    vaporModel?: VaporModelChoice
  }
  system: {
    component1: { name: string; cas: string | null; liquidMolarVolume: number | null }
    component2: { name: string; cas: string | null; liquidMolarVolume: number | null }
  }
  /** thermo VaporPressureModel fields plus the component they describe (1 = lighter) and `source`. */
  vaporPressure: (Record<string, unknown> & {
    kind: string
    source: string
    component: { index: 1 | 2; name: string; cas: string | null }
  })[]
  recommendedFitId: string | null
  fits: {
    id: string
    model: string
    /** the fit's name as the lab screens give it (packages/schemas/src/fit-label.ts) */
    label: string
    recommended: boolean
    activity: Record<string, unknown> & { kind: string }
    parameters: { name: string; value: number; standardError: number; unit: string }[]
    statistics: { rmsT?: number; rmsY?: number; aic?: number; converged?: boolean }
    /** thermo's vapour the fit was made with (a virial vapour carries the critical data it used) */
    vapor?: { kind: string } & Record<string, unknown>
    points: number
    runAt: string
  }[]
  approval: { signedBy: string; signedAt: string; reason: string; digest: string } | null
  /** The system's signed recommended parameter set (a joint fit over several data sets), null when it has none. */
  systemRecommendedSet?:
    | (Omit<RecommendedParameterSetDto, 'parameters'> & {
        parameters: { name: string; value: number; standardError: number | null; unit: string }[]
      })
    | null
}

/** A measured equilibrium state of an approved data set, the fields the design screens read: T in K, P in Pa, standard uncertainties (k = 1). */
export type MeasuredPoint = Pick<
  PointDto,
  | 'id'
  | 'seq'
  | 'sampleLabel'
  | 'temperatureK'
  | 'pressurePa'
  | 'x1'
  | 'x1Uncertainty'
  | 'y1'
  | 'y1Uncertainty'
  | 'excluded'
  | 'exclusionReason'
>

/** The part of a data set's detail the design screens read: its points and the residuals of each fit. */
export interface MeasuredData {
  points: MeasuredPoint[]
  fits: Pick<FitDto, 'id' | 'pointIds' | 'residuals'>[]
  /**
   * How far a virial vapour would move this ideal-vapour data set's bubble points, when that exceeds their
   * measurement uncertainty (`exceeds`, with the server's message); null when it does not apply.
   */
  vapourCorrection?: VapourCorrection | null
}

const base = (id: string) => `/api/data-sets/${encodeURIComponent(id)}`

/** Download URLs (the browser fetches them with the session cookie; the server names the file). */
export const exportUrls = {
  parametersJson: (dataSetId: string) => `${base(dataSetId)}/export/parameters.json`,
  parametersCsv: (dataSetId: string) => `${base(dataSetId)}/export/parameters.csv`,
  /** the signed report (PDF) of the version */
  reportPdf: (dataSetId: string) => `${base(dataSetId)}/report.pdf`,
}

/** A literature data set of a system with its citation and points (T, P in K, Pa), for the system's plots. */
export interface LiteratureSet {
  dataSetId: string
  title: string
  version: number
  state: string
  layout: string
  nominalPressurePa: number
  citation: Citation | null
  points: {
    id: string
    sampleLabel: string
    temperatureK: number
    pressurePa: number
    x1: number
    y1: number | null
    excluded: boolean
  }[]
}

export const catalogueApi = {
  /** The system's literature data sets the user may read (engineers: approved only). */
  literature: (systemId: string) =>
    api.get<{ items: LiteratureSet[]; total: number }>(`/api/systems/${encodeURIComponent(systemId)}/literature`),
  /** Approved systems whose component names or CAS numbers match `q`. */
  list: (q: string, page = 1, pageSize = 50) =>
    api.get<{ items: CatalogueEntry[]; total: number; page: number; pageSize: number }>(
      '/api/catalogue' + query({ q, page, pageSize }),
    ),
  /** Everything needed to compute with an approved version: vapour-pressure sets and every fit. */
  parameters: (dataSetId: string) => api.get<ParametersExport>(exportUrls.parametersJson(dataSetId)),
  /** The approved version's measured points (engineers may read approved versions). */
  measured: (dataSetId: string) => api.get<MeasuredData>(base(dataSetId)),
}
