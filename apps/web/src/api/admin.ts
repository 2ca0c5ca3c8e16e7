import type { Role } from '@ebullio/schemas'
import { api, query } from './client'

export interface UserRow {
  id: string
  email: string
  displayName: string
  active: boolean
  invitePending: boolean
  roles: Role[]
  createdAt: string
}

/** Query of the people list (server-side paging, search on name or e-mail). */
export interface UserQuery {
  q?: string
  role?: Role
  status?: 'active' | 'invited' | 'deactivated'
  sort?: 'name' | 'email' | 'created_at'
  order?: 'asc' | 'desc'
  page?: number
  pageSize?: number
}

export interface CapturedMail {
  id: string
  received_at: string
  envelope_from: string
  envelope_to: string
  subject: string
  body_text: string
}

/** A message the outbox could not deliver (GET /api/admin/mail-outbox). */
export interface UndeliveredMail {
  id: string
  to: string
  subject: string
  createdAt: string
  attempts: number
  lastError: string | null
  /** when it is tried next; null once given up */
  nextAttemptAt: string | null
  /** when it was given up; null while it is still being tried */
  failedAt: string | null
}

export const adminApi = {
  users: (q: UserQuery = {}) =>
    api.get<{ items: UserRow[]; total: number; page: number; pageSize: number }>('/api/admin/users' + query({ ...q })),
  invite: (body: { email: string; displayName: string; roles: Role[] }) =>
    api.post<{ id: string }>('/api/admin/users', body, { quiet: true }),
  setRoles: (id: string, roles: Role[]) => api.put<{ ok: true }>(`/api/admin/users/${id}/roles`, { roles }),
  deactivate: (id: string) => api.post<{ ok: true }>(`/api/admin/users/${id}/deactivate`),
  activate: (id: string) => api.post<{ ok: true }>(`/api/admin/users/${id}/activate`),
  mail: () => api.get<{ items: CapturedMail[] }>('/api/dev/mail'),
  undelivered: (status: 'failed' | 'retrying') =>
    api.get<{ items: UndeliveredMail[] }>('/api/admin/mail-outbox' + query({ status })),
  retryMail: (id: string) => api.post<{ id: string; status: 'queued' }>(`/api/admin/mail-outbox/${id}/retry`),
}
