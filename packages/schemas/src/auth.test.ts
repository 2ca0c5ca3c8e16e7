import { describe, expect, it } from 'vitest'
import { inviteSchema, signInSchema } from './auth.js'

describe('shared auth schemas', () => {
  it('normalises e-mail addresses', () => {
    expect(signInSchema.parse({ email: ' Ana@Lab.Example ', password: 'x' }).email).toBe('ana@lab.example')
  })
  it('names every bad field', () => {
    const r = inviteSchema.safeParse({ email: 'nope', displayName: '', roles: ['wizard'] })
    expect(r.success).toBe(false)
    const paths = r.error!.issues.map((i) => i.path.join('.'))
    expect(paths).toEqual(expect.arrayContaining(['email', 'displayName', 'roles.0']))
  })
})
