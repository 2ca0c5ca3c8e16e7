import type { Role } from '@ebullio/schemas'
import { api } from './client'

export interface UserRow {
  id: string
  email: string
  displayName: string
  active: boolean
  invitePending: boolean
  roles: Role[]
  createdAt: string
}

export interface CapturedMail {
  id: string
  received_at: string
  envelope_from: string
  envelope_to: string
  subject: string
  body_text: string
}

export const adminApi = {
  users: () => api.get<{ items: UserRow[] }>('/api/admin/users'),
  invite: (body: { email: string; displayName: string; roles: Role[] }) => api.post<{ id: string }>('/api/admin/users', body, { quiet: true }),
  setRoles: (id: string, roles: Role[]) => api.put<{ ok: true }>(`/api/admin/users/${id}/roles`, { roles }),
  deactivate: (id: string) => api.post<{ ok: true }>(`/api/admin/users/${id}/deactivate`),
  activate: (id: string) => api.post<{ ok: true }>(`/api/admin/users/${id}/activate`),
  mail: () => api.get<{ items: CapturedMail[] }>('/api/dev/mail'),
}
