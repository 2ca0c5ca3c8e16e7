/** Comment threads on a data set or pinned to one of its points. */
import { api } from './client'

export interface CommentItem {
  id: string
  dataSetId: string
  pointId: string | null
  parentId: string | null
  authorId: string
  authorName: string
  body: string
  resolved: boolean
  resolvedBy: string | null
  resolvedAt: string | null
  createdAt: string
}

/** An open thread somewhere that the signed-in person started or replied to. */
export interface MyThread {
  id: string
  dataSetId: string
  pointId: string | null
  body: string
  createdAt: string
  title: string
  version: number
}

export const commentsApi = {
  create: (dataSetId: string, body: { body: string; pointId?: string | null; parentId?: string | null }) =>
    api.post<{ id: string }>(`/api/data-sets/${dataSetId}/comments`, body, { quiet: true }),
  resolve: (dataSetId: string, id: string) => api.post<unknown>(`/api/data-sets/${dataSetId}/comments/${id}/resolve`),
  reopen: (dataSetId: string, id: string) => api.post<unknown>(`/api/data-sets/${dataSetId}/comments/${id}/reopen`),
  mine: () => api.get<{ items: MyThread[] }>('/api/comments/mine'),
}
