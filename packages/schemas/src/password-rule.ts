/**
 * Rejects the trivially weak passwords that pass a length rule: only spaces, one or a few characters repeated, a
 * keyboard or alphabet run (1234567890, qwertyuiop, abcdefghij, also backwards), and well-known passwords.
 * Deliberately small (it ships to the browser); the 10-character minimum does the rest. The common passwords are
 * "common practice, no source": the usual entries of leaked-password top lists, from memory.
 */
const RUNS = [
  '01234567890',
  'abcdefghijklmnopqrstuvwxyz',
  'qwertyuiop',
  'asdfghjkl',
  'zxcvbnm',
  'qwertzuiop',
  'azertyuiop',
]
const COMMON = new Set([
  'password',
  'password1',
  'password12',
  'password123',
  'password1234',
  'passwort123',
  'iloveyou123',
  'qwerty1234',
  'qwerty12345',
  'qwerty123456',
  '1q2w3e4r5t',
  '1q2w3e4r5t6y',
  'q1w2e3r4t5',
  'letmein123',
  'welcome123',
  'changeme123',
  'administrator',
  'abc1234567',
  'abcd123456',
  '123456789a',
  'a123456789',
  'trustno1234',
  'football123',
  'baseball123',
  'monkey12345',
  'dragon12345',
  'sunshine123',
  'princess123',
  'whatever123',
  'computer123',
  'qazwsxedc123',
  'qazwsxedcrfv',
  'zaq12wsxcde3',
  '1qaz2wsx3edc',
  '0987654321',
  '9876543210',
  '1111111111',
])

function isRun(lower: string): boolean {
  const compact = lower.replace(/[\s_-]/g, '')
  if (compact.length < 4) return false
  return RUNS.some((r) => {
    const twice = r + r
    const back = [...twice].reverse().join('')
    return twice.includes(compact) || back.includes(compact)
  })
}

/** A unit of at most 4 characters repeated (aaaaaaaaaa, abababab, 1231231231). */
function isRepetition(p: string): boolean {
  for (let n = 1; n <= 4 && n <= p.length / 2; n++) {
    const unit = p.slice(0, n)
    if (unit.repeat(Math.ceil(p.length / n)).slice(0, p.length) === p) return true
  }
  return false
}

/** Why a new password is too easy to guess, or null when it passes. */
export function weakPasswordReason(password: string): string | null {
  if (password.trim() === '') return 'A password of only spaces is too easy to guess'
  const lower = password.toLowerCase()
  if (isRepetition(lower) || new Set(lower).size < 4)
    return 'Use more different characters: a repeated character or pattern is too easy to guess'
  if (isRun(lower)) return 'A run of keys or letters (like 1234567890 or qwertyuiop) is too easy to guess'
  if (COMMON.has(lower.replace(/\s/g, ''))) return 'This is one of the most common passwords; choose another'
  return null
}
