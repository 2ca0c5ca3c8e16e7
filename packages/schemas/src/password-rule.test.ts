import { describe, expect, it } from 'vitest'
import { newPasswordSchema } from './auth.js'
import { weakPasswordReason } from './password-rule.js'

const message = (p: string) => {
  const r = newPasswordSchema.safeParse(p)
  return r.success ? null : r.error.issues[0].message
}

describe('new password rule', () => {
  it('rejects the trivially weak with a message that says why', () => {
    expect(message(' '.repeat(10))).toBe('A password of only spaces is too easy to guess')
    expect(message('1234567890')).toBe('A run of keys or letters (like 1234567890 or qwertyuiop) is too easy to guess')
    expect(message('0987654321')).toBe('A run of keys or letters (like 1234567890 or qwertyuiop) is too easy to guess')
    expect(message('QWERTYUIOP')).toBe('A run of keys or letters (like 1234567890 or qwertyuiop) is too easy to guess')
    expect(message('aaaaaaaaaaaa')).toBe(
      'Use more different characters: a repeated character or pattern is too easy to guess',
    )
    expect(message('abababababab')).toBe(
      'Use more different characters: a repeated character or pattern is too easy to guess',
    )
    expect(message('1231231231')).toBe(
      'Use more different characters: a repeated character or pattern is too easy to guess',
    )
    expect(message('Password123')).toBe('This is one of the most common passwords; choose another')
    expect(message('short')).toBe('Use at least 10 characters')
  })

  it('accepts ordinary pass phrases and random strings', () => {
    for (const p of [
      'correct-horse-battery',
      'long-enough-password',
      'ebullio-demo-2026',
      'Tq8#mZ2!vLx9',
      'bubble point 78 C',
    ])
      expect(weakPasswordReason(p), p).toBeNull()
  })
})
