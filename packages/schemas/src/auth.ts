import { z } from 'zod'
import { weakPasswordReason } from './password-rule.js'

/** The five roles of Ebullio; a user may hold several. */
export const ROLES = ['analyst', 'lead_chemist', 'reviewer', 'engineer', 'admin'] as const
export type Role = (typeof ROLES)[number]

export const ROLE_LABELS: Record<Role, string> = {
  analyst: 'Analyst',
  lead_chemist: 'Lead chemist',
  reviewer: 'Reviewer',
  engineer: 'Engineer',
  admin: 'Administrator',
}

export const roleSchema = z.enum(ROLES)
export const emailSchema = z.string().trim().toLowerCase().email('Enter a valid e-mail address').max(254)

/**
 * At least 10 characters: long enough to resist guessing, short enough to type at a lab bench; and not one of the
 * trivially weak ones (only spaces, repeated characters, key runs, well-known passwords: see password-rule.ts).
 */
export const newPasswordSchema = z
  .string()
  .min(10, 'Use at least 10 characters')
  .max(200, 'Use at most 200 characters')
  .superRefine((p, ctx) => {
    if (p.length < 10) return
    const reason = weakPasswordReason(p)
    if (reason) ctx.addIssue({ code: 'custom', message: reason })
  })

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string().min(1, 'Enter your password').max(200),
})

export const inviteSchema = z.object({
  email: emailSchema,
  displayName: z.string().trim().min(1, 'Enter a name').max(120),
  roles: z.array(roleSchema).min(1, 'Choose at least one role'),
})

export const acceptInviteSchema = z.object({
  token: z.string().min(20).max(200),
  password: newPasswordSchema,
})

export const forgotPasswordSchema = z.object({ email: emailSchema })

export const resetPasswordSchema = z.object({
  token: z.string().min(20).max(200),
  password: newPasswordSchema,
})

export const changePasswordSchema = z.object({
  currentPassword: z.string().min(1, 'Enter your current password'),
  newPassword: newPasswordSchema,
})

export const setRolesSchema = z.object({ roles: z.array(roleSchema) })

export interface SessionUserDto {
  id: string
  email: string
  displayName: string
  roles: Role[]
}
