/** The signature steps: approve or return a submitted data set, with the password re-entered. */
import { api } from './client'
import type { Approval, DataSet } from './datasets'

export interface SignatureBody {
  password: string
  reason: string
  /** needed when unresolved threads remain */
  overrideReason?: string
  rowVersion?: number
}

export const approvalsApi = {
  approve: (dataSetId: string, body: SignatureBody) =>
    api.post<{ dataSet: DataSet; approval: Approval }>(`/api/data-sets/${dataSetId}/approve`, body, { quiet: true }),
  giveBack: (dataSetId: string, body: SignatureBody) =>
    api.post<{ dataSet: DataSet; approval: Approval }>(`/api/data-sets/${dataSetId}/return`, body, { quiet: true }),
}
