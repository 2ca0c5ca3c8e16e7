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
  [k: string]: unknown
}

export const commentsApi = {
  list: (dataSetId: string) => api.get<{ items: CommentItem[] }>(`/api/data-sets/${dataSetId}/comments`),
  create: (dataSetId: string, body: { body: string; pointId?: string | null; parentId?: string | null }) =>
    api.post<{ id: string }>(`/api/data-sets/${dataSetId}/comments`, body, { quiet: true }),
  resolve: (id: string) => api.post<{ ok: true }>(`/api/comments/${id}/resolve`),
  reopen: (id: string) => api.post<{ ok: true }>(`/api/comments/${id}/reopen`),
  mine: () => api.get<{ items: MyThread[] }>('/api/comments/mine'),
}
