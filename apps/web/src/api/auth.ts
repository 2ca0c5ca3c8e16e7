import type { Role } from '@ebullio/schemas'
import { api } from './client'

export interface Me {
  id: string
  email: string
  displayName: string
  roles: Role[]
  notifyMail: boolean
}

export const authApi = {
  me: () => api.get<{ user: Me; devMode: boolean; labName: string }>('/api/auth/me', { quiet: true }),
  signIn: (email: string, password: string) =>
    api.post<{ ok: true }>('/api/auth/sign-in', { email, password }, { quiet: true }),
  signOut: () => api.post<{ ok: true }>('/api/auth/sign-out'),
  forgot: (email: string) =>
    api.post<{ ok: true; message: string }>('/api/auth/forgot-password', { email }, { quiet: true }),
  reset: (token: string, password: string) =>
    api.post<{ ok: true }>('/api/auth/reset-password', { token, password }, { quiet: true }),
  invite: (token: string) =>
    api.get<{ email: string; displayName: string }>(`/api/auth/invites/${encodeURIComponent(token)}`, { quiet: true }),
  acceptInvite: (token: string, password: string) =>
    api.post<{ ok: true }>('/api/auth/accept-invite', { token, password }, { quiet: true }),
  changePassword: (currentPassword: string, newPassword: string) =>
    api.post<{ ok: true }>('/api/auth/change-password', { currentPassword, newPassword }, { quiet: true }),
  preferences: (notifyMail: boolean) => api.patch<{ ok: true }>('/api/auth/me/preferences', { notifyMail }),
}
